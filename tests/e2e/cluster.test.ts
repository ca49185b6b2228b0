import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import bcrypt from 'bcryptjs';
import { QueryTypes, type Sequelize } from 'sequelize';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startFakeS3, type FakeS3 } from '../../fakes/s3/server';
import { createSequelize } from '../../lib/db';
import { waitForOk } from '../../lib/migrator';
import { ensureNginx, freePort, writeNginxConfig } from '../../scripts/cluster/nginx';
import { openBrowser, seriousViolations, signIn } from './support/browser';
import { startAppServer } from '../../scripts/app-server';

// Two app servers (`next start` of the e2e build) behind nginx, sharing the e2e database and an
// S3-compatible bucket (fakes/s3). A learner signs in and uploads a practical photo through nginx;
// each app server, asked on its own port, serves the same bytes, so whichever did not take the
// upload serves the other's photo. Then what must not live in one process: sessions (JWTs),
// sign-in throttling and workshop seats (MariaDB), and nginx passing over a stopped server.

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const run = randomBytes(3).toString('hex');
const PASSWORD = 'cluster-test-pass-0001';
const ACCESS_KEY = 'BRINEWRIGHTE2EKEY001';
const SECRET = randomBytes(20).toString('hex');
const BUCKET = 'brinewright-e2e-photos';
// Requests sent straight to an app server carry an address of their own (TEST-NET-2, RFC 5737), so
// their failed sign-ins never count against the address the other browser tests share.
const address = (n: number) => `198.51.100.${n}`;

type App = { name: string; url: string; child: ChildProcess };
type Learner = { id: number; email: string };

let sequelize: Sequelize;
let fake: FakeS3;
let work: string;
let nginx: ChildProcess | undefined;
let nginxUrl: string;
const apps: App[] = [];
let courseId: number;
let workshopId: number;
let waiverId: number;
const learners: Record<'uploader' | 'locked' | 'racerA' | 'racerB', Learner> = {} as never;
const WAIVER = `CLUSTER-${run.toUpperCase()}`;

const query = <T extends object>(sql: string, replacements: unknown[] = []) => sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });

async function makeLearner(label: string): Promise<Learner> {
  const email = `${label}-${run}@cluster.test.example`;
  const now = new Date();
  await sequelize.query('INSERT INTO users (email, name, roles, passwordHash, emailVerifiedAt, createdAt, updatedAt) VALUES (?, ?, ?, ?, ?, ?, ?)', {
    replacements: [email, `Cluster ${label} ${run}`, 'learner', bcrypt.hashSync(PASSWORD, 10), now, now, now],
  });
  const [row] = await query<{ id: number }>('SELECT id FROM users WHERE email = ?', [email]);
  return { id: row.id, email };
}

function stopChild(child: ChildProcess | undefined): Promise<void> {
  if (!child || child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    const timer = setTimeout(() => child.kill('SIGKILL'), 10_000);
    child.once('exit', () => {
      clearTimeout(timer);
      resolve();
    });
    child.kill('SIGTERM');
  });
}

/** Signs in through next-auth's credentials endpoint of one server; answers the session cookie (null when refused) and the status. */
async function apiSignIn(base: string, email: string, password: string, from: string): Promise<{ cookie: string | null; status: number }> {
  const csrf = await fetch(`${base}/api/auth/csrf`, { headers: { 'x-forwarded-for': from } });
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const jar = csrf.headers.getSetCookie().map((c) => c.split(';')[0]);
  const response = await fetch(`${base}/api/auth/callback/credentials`, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded', cookie: jar.join('; '), 'x-forwarded-for': from },
    body: new URLSearchParams({ csrfToken, email, password, callbackUrl: `${nginxUrl}/pantry`, json: 'true' }),
  });
  await response.arrayBuffer();
  const session = response.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .filter((c) => c.startsWith('next-auth.session-token'));
  return { cookie: session.length ? session.join('; ') : null, status: response.status };
}

beforeAll(async () => {
  const databaseUrl = process.env.E2E_DATABASE_URL;
  if (!databaseUrl || !process.env.E2E_BASE_URL) throw new Error('E2E_DATABASE_URL / E2E_BASE_URL are not set: the e2e global setup did not run');
  const distDir = process.env.E2E_DIST_DIR ?? '.next-e2e';
  if (!fs.existsSync(path.join(root, distDir, 'BUILD_ID'))) throw new Error(`No production build in ${distDir}: the e2e global setup makes it`);
  work = fs.mkdtempSync(path.join(os.tmpdir(), 'brinewright-cluster-'));
  sequelize = createSequelize(databaseUrl, { poolMax: 2 });

  // Our own learners, workshop and waiver, so nothing another browser test relies on changes.
  const [course] = await query<{ id: number }>("SELECT id FROM courses WHERE slug = 'pickling-and-canning'");
  const [instructor] = await query<{ id: number }>("SELECT id FROM users WHERE email = 'instructor@cedarhollow.example'");
  courseId = course.id;
  const now = new Date();
  const startsAt = new Date(now.getTime() + 400 * 24 * 3600_000);
  // Two seats: the uploader holds one, two learners race for the other.
  await sequelize.query(
    'INSERT INTO workshops (courseId, instructorId, startsAt, endsAt, timeZone, place, seats, attendanceRequired, createdAt, updatedAt) VALUES (?, ?, ?, ?, ?, ?, 2, 1, ?, ?)',
    {
      replacements: [courseId, instructor.id, startsAt, new Date(startsAt.getTime() + 5 * 3600_000), 'America/Denver', `Cluster test kitchen ${run}`, now, now],
    },
  );
  [{ id: workshopId }] = await query<{ id: number }>('SELECT id FROM workshops WHERE place = ?', [`Cluster test kitchen ${run}`]);
  await sequelize.query(
    'INSERT INTO fee_waivers (code, courseId, createdById, maxUses, uses, expiresAt, note, createdAt, updatedAt) VALUES (?, ?, NULL, 10, 0, ?, ?, ?, ?)',
    {
      replacements: [WAIVER, courseId, startsAt, 'cluster browser test', now, now],
    },
  );
  [{ id: waiverId }] = await query<{ id: number }>('SELECT id FROM fee_waivers WHERE code = ?', [WAIVER]);
  for (const label of ['uploader', 'locked', 'racerA', 'racerB'] as const) learners[label] = await makeLearner(label.toLowerCase());
  await sequelize.query(
    "INSERT INTO enrollments (userId, courseId, workshopId, runKey, status, feeCents, feeWaiverId, createdAt, updatedAt) VALUES (?, ?, ?, ?, 'active', 0, ?, ?, ?)",
    {
      replacements: [learners.uploader.id, courseId, workshopId, String(workshopId), waiverId, now, now],
    },
  );

  fake = await startFakeS3({ root: path.join(work, 's3'), accessKeyId: ACCESS_KEY, secretAccessKey: SECRET, buckets: [BUCKET] });
  const [portA, portB, nginxPort] = [await freePort(), await freePort(), await freePort()];
  nginxUrl = `http://127.0.0.1:${nginxPort}`;
  const e2ePort = Number(process.env.E2E_PORT ?? 3100);
  const env = {
    ...process.env,
    NODE_ENV: 'production' as const,
    NEXT_TELEMETRY_DISABLED: '1',
    NEXT_DIST_DIR: distDir,
    DATABASE_URL: databaseUrl,
    DB_POOL_MAX: '4',
    // Both servers: the same secret (JWT sessions) and nginx's address as the public one.
    NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? 'e2e-secret-0123456789abcdef',
    NEXTAUTH_URL: nginxUrl,
    APP_URL: nginxUrl,
    // The fakes the e2e global setup started.
    STRIPE_API_HOST: '127.0.0.1',
    STRIPE_API_PORT: String(e2ePort + 1),
    STRIPE_API_PROTOCOL: 'http',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(e2ePort + 2),
    MAILBOX_URL: `http://127.0.0.1:${e2ePort + 3}`,
    STORAGE_DRIVER: 's3',
    S3_ENDPOINT: fake.url,
    S3_REGION: 'us-east-1',
    S3_BUCKET: BUCKET,
    S3_ACCESS_KEY_ID: ACCESS_KEY,
    S3_SECRET_ACCESS_KEY: SECRET,
    S3_FORCE_PATH_STYLE: 'true',
    SIGNIN_MAX_PER_ACCOUNT_ADDRESS: '3',
    AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true',
  };
  for (const [name, port] of [
    ['A', portA],
    ['B', portB],
  ] as const) {
    const child = startAppServer(port, env);
    apps.push({ name, url: `http://127.0.0.1:${port}`, child });
  }
  const bin = ensureNginx();
  const conf = writeNginxConfig({ dir: path.join(work, 'nginx'), port: nginxPort, upstreams: [`127.0.0.1:${portA}`, `127.0.0.1:${portB}`] });
  nginx = spawn(bin, ['-c', conf, '-p', path.join(work, 'nginx')], { stdio: ['ignore', 'inherit', 'inherit'] });
  for (const app of apps) await waitForOk(`${app.url}/api/health`, 90_000);
  await waitForOk(`${nginxUrl}/api/health`, 20_000);
});

afterAll(async () => {
  await Promise.allSettled([...apps.map((a) => stopChild(a.child)), stopChild(nginx)]);
  await fake?.close();
  if (sequelize) {
    // Take back what this file added to the shared e2e database.
    const ids = Object.values(learners).map((l) => l.id);
    try {
      await sequelize.transaction(async (transaction) => {
        const q = (sql: string, replacements: unknown[]) => sequelize.query(sql, { replacements, transaction });
        await q('SET FOREIGN_KEY_CHECKS = 0', []);
        if (ids.length) {
          await q('DELETE FROM practical_photos WHERE userId IN (?)', [ids]);
          await q('DELETE FROM audit_logs WHERE actorId IN (?)', [ids]);
          await q('DELETE FROM enrollments WHERE userId IN (?)', [ids]);
          await q('DELETE FROM outbox_emails WHERE toAddress IN (?)', [Object.values(learners).map((l) => l.email)]);
          await q('DELETE FROM users WHERE id IN (?)', [ids]);
        }
        await q("DELETE FROM rate_limits WHERE bucket LIKE ? OR bucket LIKE ? OR bucket LIKE 'signin:address:198.51.100.%'", [
          `signin:%-${run}@cluster.test.example`,
          'signin:pair:198.51.100.%',
        ]);
        if (workshopId) await q('DELETE FROM workshops WHERE id = ?', [workshopId]);
        if (waiverId) await q('DELETE FROM fee_waivers WHERE id = ?', [waiverId]);
        await q('SET FOREIGN_KEY_CHECKS = 1', []);
      });
    } finally {
      await sequelize.close();
    }
  }
  if (work) fs.rmSync(work, { recursive: true, force: true });
});

describe('two app servers behind nginx, sharing MariaDB and an S3 bucket', () => {
  let cookie: string;
  let photo: { id: number; url: string };
  let bytes: Buffer;

  it('a learner signs in and uploads a photo through nginx; both app servers serve the same bytes from the bucket', async () => {
    const folder = path.join(work, 'upload');
    fs.mkdirSync(folder);
    const file = path.join(folder, 'cluster-jars.jpg');
    await sharp({ create: { width: 900, height: 600, channels: 3, background: '#4d7a5a' } })
      .jpeg()
      .toFile(file);

    const browser = await openBrowser(nginxUrl);
    try {
      const { context, page } = browser;
      await signIn(page, learners.uploader.email, PASSWORD);
      await page.goto('/learn/pickling-and-canning/practical');
      await page.getByRole('heading', { name: 'Practical batch', level: 1 }).waitFor();
      expect(await seriousViolations(page)).toEqual([]);

      const upload = page.waitForResponse((r) => new URL(r.url()).pathname === '/api/photos' && r.request().method() === 'POST');
      await page.getByLabel(/^Photos/).setInputFiles([file]);
      const answer = await upload;
      expect(answer.status()).toBe(201);
      photo = ((await answer.json()) as { photo: { id: number; url: string } }).photo;
      await page.getByText('Uploaded', { exact: true }).waitFor();
      expect(await page.getByRole('img', { name: /Photo 1: cluster-jars\.jpg/ }).count()).toBe(1);
      expect(await seriousViolations(page)).toEqual([]);
      cookie = (await context.cookies())
        .filter((c) => c.name.startsWith('next-auth.session-token'))
        .map((c) => `${c.name}=${c.value}`)
        .join('; ');
    } finally {
      await browser.close();
    }
    expect(cookie).toMatch(/^next-auth\.session-token=/);

    // Each server on its own port, with the session made through nginx.
    const served: Buffer[] = [];
    for (const app of apps) {
      const response = await fetch(`${app.url}${photo.url}`, { headers: { cookie } });
      expect(response.status, `server ${app.name}`).toBe(200);
      expect(response.headers.get('content-type')).toBe('image/jpeg');
      served.push(Buffer.from(await response.arrayBuffer()));
      // Without the session neither server shows it.
      expect((await fetch(`${app.url}${photo.url}`)).status, `server ${app.name} without a session`).toBe(401);
    }
    expect(served[0].equals(served[1])).toBe(true);
    bytes = served[0];
    const meta = await sharp(bytes).metadata();
    expect([meta.format, meta.width, meta.height]).toEqual(['jpeg', 900, 600]);

    // The bytes live in the bucket, not on either server's disk.
    const [row] = await query<{ storageKey: string; thumbnailKey: string; userId: number }>(
      'SELECT storageKey, thumbnailKey, userId FROM practical_photos WHERE id = ?',
      [photo.id],
    );
    expect(row.userId).toBe(learners.uploader.id);
    expect(fs.readFileSync(path.join(work, 's3', BUCKET, 'objects', ...row.storageKey.split('/'))).equals(bytes)).toBe(true);
    expect(fs.existsSync(path.join(work, 's3', BUCKET, 'objects', ...row.thumbnailKey.split('/')))).toBe(true);
    expect(fs.existsSync(path.join(root, '.data', 'photos', row.storageKey))).toBe(false);
    expect(fake.counts.PutObject).toBe(2); // the photo and its thumbnail, nothing else
    expect(fake.counts.GetObject).toBeGreaterThanOrEqual(2);
    expect(fake.counts.refused ?? 0).toBe(0);
  }, 180_000); // two freshly started servers and axe: room for a loaded machine

  it('sessions are JWTs: the cookie made through nginx is a session on both servers, and no table holds sessions', async () => {
    // next-auth 4 keeps the session in an encrypted JWT (JWE compact form: five parts).
    expect(cookie.split('=')[1]).toMatch(/^[\w-]+\.[\w-]*\.[\w-]+\.[\w-]+\.[\w-]+$/);
    for (const app of apps) {
      const session = (await (await fetch(`${app.url}/api/auth/session`, { headers: { cookie } })).json()) as { user?: { email: string; roles: string[] } };
      expect(session.user, `server ${app.name}`).toMatchObject({ email: learners.uploader.email, roles: ['learner'] });
    }
    const tables = await query<{ name: string }>(
      "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() AND table_name LIKE '%session%'",
    );
    expect(tables).toEqual([]);
  });

  it('sign-in throttling is counted in MariaDB: failures spread over both servers use up the e-mail and address on both', async () => {
    const { email } = learners.locked;
    const from = address(10);
    // SIGNIN_MAX_PER_ACCOUNT_ADDRESS is 3 on both servers: A, B, A.
    for (const [i, app] of [apps[0], apps[1], apps[0]].entries()) {
      const attempt = await apiSignIn(app.url, email, `wrong-password-${i}`, from);
      expect(attempt, `failure ${i + 1} on ${app.name}`).toEqual({ cookie: null, status: 401 });
    }
    const attempts = async () =>
      Number((await query<{ hits: number }>('SELECT hits FROM rate_limits WHERE bucket = ?', [`signin:pair:${from}|${email}`]))[0]?.hits);
    expect(await attempts()).toBe(3);
    // Now the right password is refused (429) on B and on A alike. It is the shared count that
    // refuses it, before the password is checked: each refused attempt is counted too.
    for (const app of [apps[1], apps[0]]) {
      expect(await apiSignIn(app.url, email, PASSWORD, from), `server ${app.name}`).toEqual({ cookie: null, status: 429 });
    }
    expect(await attempts()).toBe(5);
    // Another account from another address still signs in on either server.
    expect((await apiSignIn(apps[1].url, learners.racerA.email, PASSWORD, address(11))).cookie).toMatch(/^next-auth\.session-token=/);
  });

  it('workshop seats are counted under a row lock in MariaDB: two learners on two servers race for the last seat, one gets it', async () => {
    const a = await apiSignIn(apps[0].url, learners.racerA.email, PASSWORD, address(12));
    const b = await apiSignIn(apps[1].url, learners.racerB.email, PASSWORD, address(13));
    expect(a.cookie && b.cookie).toBeTruthy();
    const enroll = (app: App, session: string) =>
      fetch(`${app.url}/api/enrollments`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', cookie: session },
        body: JSON.stringify({ workshopId, waiverCode: WAIVER }),
      });
    const answers = await Promise.all([enroll(apps[0], a.cookie!), enroll(apps[1], b.cookie!)]);
    expect(answers.map((r) => r.status).sort()).toEqual([201, 409]);
    const refused = answers.find((r) => r.status === 409)!;
    expect(JSON.stringify(await refused.json())).toContain('This workshop is full');
    const [holders] = await query<{ n: number }>("SELECT COUNT(*) AS n FROM enrollments WHERE workshopId = ? AND status IN ('awaiting_payment', 'active')", [
      workshopId,
    ]);
    expect(Number(holders.n)).toBe(2);
  });

  it('with one app server stopped, nginx sends every request to the other (proxy_next_upstream)', async () => {
    await stopChild(apps[0].child);
    await expect(fetch(`${apps[0].url}/api/health`)).rejects.toThrow();
    // Round robin would send every other request to the stopped server.
    for (let i = 0; i < 6; i++) {
      const response = await fetch(`${nginxUrl}${photo.url}`, { headers: { cookie } });
      expect(response.status, `request ${i + 1}`).toBe(200);
      expect(Buffer.from(await response.arrayBuffer()).equals(bytes)).toBe(true);
    }
    // Signing in (a POST) works through nginx too.
    expect((await apiSignIn(nginxUrl, learners.racerB.email, PASSWORD, address(14))).cookie).toMatch(/^next-auth\.session-token=/);
  });
});

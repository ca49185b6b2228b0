// The database goes away in the middle of a 60-second load of quiz submissions and comes back.
//
// This test starts everything it needs beside the browser tests' own server: a MariaDB of its own
// (scripts/db.sh with its own port and data folder under .data/, never the shared server), the demo
// seed, and the app (`next start`) of the browser tests' production build (E2E_DIST_DIR) on a free port.
// Learners start and submit quiz attempts for 60 s at bounded concurrency; 20 s in, MariaDB is
// killed (SIGKILL, the harshest stop: no chance to finish anything), kept down for 10 s and started
// again. Then it checks:
// - every submission the app acknowledged with 2xx is in the database with its score and answers;
// - while the database was stopped every answer was a 503 with a clear JSON message, and fast (once its
//   restart has begun, 2xx answers are allowed too: the app may reach it before this test's probe does);
// - the app answered 2xx again within 5 s of the database answering, without being restarted.
// Expected run time: about 100 s (plus the shared build of the browser tests).
import { execFile, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { promisify } from 'node:util';
import * as mariadb from 'mariadb';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createSequelize } from '../../lib/db';
import { rebuildDatabase, waitForOk } from '../../lib/migrator';
import { startAppServer, stopAppServer } from '../../scripts/app-server';
import { mariadbOptions } from '../support/mariadb-options';

const root = path.resolve(__dirname, '../..');
const run = promisify(execFile);

const LOAD_MS = 60_000;
const KILL_AT_MS = 20_000;
const DOWN_MS = 10_000;
const LEARNERS = 8; // bounded concurrency: one request in flight per learner
const PASSWORD = 'demo-learner-pass';
const QUIZZES = ['pickling-and-canning--acidity', 'pickling-and-canning--processing', 'pickling-and-canning--jars-packing-and-headspace'];
/** The bounds this test asserts for answers given while the database is down. */
const OUTAGE_P95_MS = 1_000;
const OUTAGE_MAX_MS = 5_000;
const RECOVERY_MS = 5_000;

const freePort = () =>
  new Promise<number>((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });

type Call = { kind: 'start' | 'submit'; startedAt: number; endedAt: number; status: number; body: unknown };
type Ack = { attemptId: number; scorePct: number; passed: boolean; correct: number; total: number; questions: number; userId: number };

let dbPort = 0;
let dataDir = '';
let dbUrl = '';
let app: ChildProcess | undefined;
let appUrl = '';
const dbEnv = () => ({ ...process.env, BRINEWRIGHT_DB_PORT: String(dbPort), BRINEWRIGHT_DATA_DIR: dataDir });
const pidFile = () => path.join(dataDir, 'run', `mariadb-${dbPort}.pid`);

async function startDb() {
  await run('bash', [path.join(root, 'scripts/db.sh'), 'start'], { env: dbEnv(), cwd: root });
}

function readPid(): number {
  return Number(fs.readFileSync(pidFile(), 'utf8').trim());
}

async function waitGone(pid: number, timeoutMs: number) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      process.kill(pid, 0);
    } catch {
      return;
    }
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`mariadbd ${pid} still running after ${timeoutMs} ms`);
}

/** Kills this test's own mariadbd (never the shared one: the pid comes from this test's data folder). */
async function killDb(signal: NodeJS.Signals) {
  const pid = readPid();
  process.kill(pid, signal);
  await waitGone(pid, 30_000);
}

async function signInCookie(email: string): Promise<string> {
  const csrf = await fetch(`${appUrl}/api/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const jar = csrf.headers.getSetCookie().map((c) => c.split(';')[0]);
  const signIn = await fetch(`${appUrl}/api/auth/callback/credentials`, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded', cookie: jar.join('; ') },
    body: new URLSearchParams({ csrfToken, email, password: PASSWORD, json: 'true' }),
  });
  const session = signIn.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .find((c) => c.includes('session-token'));
  if (!session) throw new Error(`sign-in of ${email} failed (${signIn.status})`);
  return session;
}

type PublicQuestion = { id: string; kind: 'single' | 'multiple' | 'true-false' | 'numeric'; choices?: { id: string }[]; units?: string[] };

/** Some answer to every question (right or wrong does not matter here; the score is recorded). */
function answersFor(questions: PublicQuestion[]) {
  const answers: Record<string, unknown> = {};
  for (const q of questions) {
    const pick = <T>(xs: T[]) => xs[Math.floor(Math.random() * xs.length)];
    if (q.kind === 'single') answers[q.id] = pick(q.choices!).id;
    else if (q.kind === 'multiple') answers[q.id] = [pick(q.choices!).id];
    else if (q.kind === 'true-false') answers[q.id] = Math.random() < 0.5;
    else answers[q.id] = { value: Math.round(Math.random() * 100) / 10, unit: q.units![0] };
  }
  return answers;
}

/** Tries a new connection every 20 ms until one succeeds; answers when it did. */
async function firstConnection(starting: Promise<unknown>): Promise<number> {
  let failed: unknown = null;
  starting.catch((error) => (failed = error));
  for (;;) {
    if (failed) throw failed;
    try {
      const conn = await mariadb.createConnection({ ...mariadbOptions(dbUrl), connectTimeout: 250 });
      const at = Date.now();
      await conn.end();
      return at;
    } catch {
      await new Promise((r) => setTimeout(r, 20));
    }
  }
}

const percentile = (values: number[], p: number) => {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))] ?? NaN;
};

beforeAll(async () => {
  dbPort = await freePort();
  // The shared server (3307 or the one `npm test` uses) must never be the one this test stops.
  const shared = new Set([3307, Number(process.env.BRINEWRIGHT_DB_PORT ?? 3307), Number(new URL(process.env.E2E_DATABASE_URL ?? 'mariadb://x@h:3307/x').port)]);
  if (shared.has(dbPort)) throw new Error(`picked port ${dbPort}, which the shared MariaDB uses`);
  dataDir = path.join(root, '.data', `db-restart-${process.pid}-${dbPort}`);
  await startDb();
  const { stdout } = await run('bash', [path.join(root, 'scripts/db.sh'), 'url', 'brinewright_dbrestart'], { env: dbEnv(), cwd: root });
  dbUrl = stdout.trim();
  await rebuildDatabase(dbUrl, { allowed: /^brinewright_dbrestart$/, purpose: 'the database-restart test', seed: true });

  // More learners like the demo's Maren: same password hash, an active place in the same workshop.
  const sequelize = createSequelize(dbUrl);
  try {
    const now = new Date();
    for (let i = 1; i < LEARNERS; i++) {
      await sequelize.query(
        `INSERT INTO users (email, name, passwordHash, roles, emailVerifiedAt, createdAt, updatedAt)
         SELECT :email, :name, passwordHash, 'learner', :now, :now, :now FROM users WHERE email = 'learner@cedarhollow.example'`,
        { replacements: { email: `load-learner-${i}@cedarhollow.example`, name: `Load Learner ${i}`, now } },
      );
      await sequelize.query(
        `INSERT INTO enrollments (userId, courseId, workshopId, runKey, status, feeCents, createdAt, updatedAt)
         SELECT u.id, e.courseId, e.workshopId, e.runKey, 'active', e.feeCents, :now, :now
           FROM users u, enrollments e JOIN users m ON m.id = e.userId AND m.email = 'learner@cedarhollow.example'
          JOIN courses c ON c.id = e.courseId AND c.slug = 'pickling-and-canning'
          WHERE u.email = :email AND e.status = 'active'`,
        { replacements: { email: `load-learner-${i}@cedarhollow.example`, now } },
      );
    }
  } finally {
    await sequelize.close();
  }

  const port = await freePort();
  appUrl = `http://127.0.0.1:${port}`;
  const distDir = process.env.E2E_DIST_DIR ?? '.next-e2e';
  if (!fs.existsSync(path.join(root, distDir, 'BUILD_ID'))) throw new Error(`no production build in ${distDir}: the e2e global setup makes it`);
  app = startAppServer(
    port,
    {
      ...process.env,
      NODE_ENV: 'production',
      NEXT_TELEMETRY_DISABLED: '1',
      NEXT_DIST_DIR: distDir,
      DATABASE_URL: dbUrl,
      NEXTAUTH_URL: appUrl,
      APP_URL: appUrl,
      NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? 'e2e-secret-0123456789abcdef',
    },
    { stdio: ['ignore', 'ignore', 'pipe'] },
  );
  app.stderr!.on('data', (c) => process.stderr.write(`[db-restart app] ${c}`));
  await waitForOk(`${appUrl}/api/health`, 60_000);
}, 240_000);

afterAll(async () => {
  await stopAppServer(app);
  if (dataDir && fs.existsSync(pidFile())) {
    try {
      await killDb('SIGTERM');
    } catch {
      // already stopped
    }
  }
  if (dataDir) fs.rmSync(dataDir, { recursive: true, force: true });
}, 60_000);

describe('the database restarted during a load of quiz submissions', () => {
  it('keeps every acknowledged submission, answers 503 fast while it is down and recovers within 5 s', { timeout: 150_000 }, async () => {
    const emails = ['learner@cedarhollow.example', ...Array.from({ length: LEARNERS - 1 }, (_, i) => `load-learner-${i + 1}@cedarhollow.example`)];
    const cookies = await Promise.all(emails.map(signInCookie));

    const calls: Call[] = [];
    const acks = new Map<number, Ack>();
    const t0 = Date.now();
    const stopAt = t0 + LOAD_MS;

    async function call(kind: Call['kind'], url: string, cookie: string, body?: unknown): Promise<Call> {
      const startedAt = Date.now();
      let status = 0;
      let json: unknown = null;
      try {
        const response = await fetch(url, {
          method: 'POST',
          headers: { cookie, 'content-type': 'application/json' },
          body: body === undefined ? undefined : JSON.stringify(body),
          signal: AbortSignal.timeout(20_000),
        });
        status = response.status;
        json = await response.json().catch(() => null);
      } catch (error) {
        json = { transportError: String(error) };
      }
      const c: Call = { kind, startedAt, endedAt: Date.now(), status, body: json };
      calls.push(c);
      return c;
    }

    const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));
    async function learner(index: number) {
      const cookie = cookies[index];
      let n = index;
      while (Date.now() < stopAt) {
        const quiz = QUIZZES[n++ % QUIZZES.length];
        const started = await call('start', `${appUrl}/api/quizzes/${quiz}/attempts`, cookie);
        if (started.status !== 200 && started.status !== 201) {
          await pause(100);
          continue;
        }
        const attempt = (started.body as { attempt: { id: number; questions: PublicQuestion[] } }).attempt;
        const answers = answersFor(attempt.questions);
        // Submit until acknowledged (a client retrying after a 503), or the load ends.
        while (Date.now() < stopAt) {
          const submitted = await call('submit', `${appUrl}/api/attempts/${attempt.id}/submit`, cookie, { answers });
          if (submitted.status === 200) {
            const r = (submitted.body as { attempt: { result: { scorePct: number; passed: boolean; correct: number; total: number; questions: unknown[] } } })
              .attempt.result;
            const ack: Ack = {
              attemptId: attempt.id,
              scorePct: r.scorePct,
              passed: r.passed,
              correct: r.correct,
              total: r.total,
              questions: r.questions.length,
              userId: index,
            };
            const before = acks.get(attempt.id);
            // A repeated submit must give back the stored result, never a second grading.
            if (before) expect(ack).toEqual(before);
            acks.set(attempt.id, ack);
            break;
          }
          await pause(100);
        }
      }
    }

    let killedAt = 0;
    let restartAt = 0;
    let upAt = 0;
    const outage = (async () => {
      await pause(KILL_AT_MS);
      killedAt = Date.now();
      await killDb('SIGKILL');
      await pause(DOWN_MS - (Date.now() - killedAt));
      restartAt = Date.now();
      const started = startDb();
      // "The database is back" = the first moment a fresh connection to it succeeds.
      upAt = await firstConnection(started);
      await started;
    })();

    await Promise.all([...cookies.map((_, i) => learner(i)), outage]);

    // ---- what the load saw
    const ok = (c: Call) => c.status === 200 || c.status === 201;
    const unexpected = calls.filter((c) => !ok(c) && c.status !== 503);
    // Answers given wholly while the database was down (from just after the kill until it answered again).
    const during = calls.filter((c) => c.startedAt >= killedAt + 200 && c.endedAt <= upAt);
    // While the server is stopped every answer must be a 503. Once its restart has begun the app's pool can
    // reach it before this test's probe does (seen in CI: a 2xx 0.8 s after the restart began, before the
    // probe's first success), so answers that start after the restart may be 2xx as well as 503.
    const stopped = during.filter((c) => c.endedAt <= restartAt);
    const starting = during.filter((c) => c.startedAt >= restartAt);
    const unavailable = during.filter((c) => c.status === 503);
    const outageLatencies = unavailable.map((c) => c.endedAt - c.startedAt);
    const p50 = percentile(outageLatencies, 50);
    const p95 = percentile(outageLatencies, 95);
    const max = Math.max(...outageLatencies);
    const firstOk = calls.filter((c) => ok(c) && c.startedAt >= restartAt).sort((a, b) => a.endedAt - b.endedAt)[0];
    const recoveryMs = firstOk ? Math.max(0, firstOk.endedAt - upAt) : Infinity;
    const afterRecovery = calls.filter((c) => c.startedAt >= upAt + RECOVERY_MS);
    const describe = (cs: Call[]) => {
      const l = cs.map((c) => c.endedAt - c.startedAt);
      return `${l.length} answers, p50 ${percentile(l, 50)} ms, p95 ${percentile(l, 95)} ms, max ${l.length ? Math.max(...l) : NaN} ms`;
    };
    const acked = calls.filter((c) => c.kind === 'submit' && c.status === 200).map((c) => c.endedAt);

    console.log(
      `[db-restart] ${calls.length} requests in ${LOAD_MS / 1000} s by ${LEARNERS} learners; ${acks.size} submissions acknowledged ` +
        `(${acked.filter((t) => t < killedAt).length} before the kill, ${acked.filter((t) => t > upAt).length} after the database answered again); ` +
        `killed at ${((killedAt - t0) / 1000).toFixed(1)} s, restart begun ${((restartAt - killedAt) / 1000).toFixed(1)} s later, answering ${((upAt - killedAt) / 1000).toFixed(1)} s after the kill; ` +
        `${during.length} answers while down: ${unavailable.length} × 503, p50 ${p50} ms, p95 ${p95} ms, max ${max} ms ` +
        `(server stopped: ${describe(stopped)}; server starting: ${describe(starting)}, ${starting.filter(ok).length} of them 2xx); ` +
        `(for comparison, 2xx answers before the kill: ${describe(calls.filter((c) => ok(c) && c.endedAt < killedAt))}); ` +
        `first 2xx ${recoveryMs} ms after the database answered; ${afterRecovery.length} requests from 5 s after that, ${afterRecovery.filter((c) => !ok(c)).length} not 2xx; ` +
        `${unexpected.length} answers other than 2xx/503`,
    );

    expect(unexpected.map((c) => ({ kind: c.kind, status: c.status, at: c.startedAt - t0, body: c.body }))).toEqual([]);
    expect(stopped.length).toBeGreaterThan(20);
    const late = (cs: Call[]) => cs.map((c) => ({ status: c.status, at: c.startedAt - t0, took: c.endedAt - c.startedAt }));
    expect(late(stopped.filter((c) => c.status !== 503))).toEqual([]);
    expect(late(during.filter((c) => c.status !== 503 && !(ok(c) && c.startedAt >= restartAt)))).toEqual([]);
    for (const c of unavailable) expect(c.body).toMatchObject({ error: 'unavailable', message: expect.stringMatching(/database/i) });
    expect(p95).toBeLessThan(OUTAGE_P95_MS);
    expect(max).toBeLessThan(OUTAGE_MAX_MS);
    expect(recoveryMs).toBeLessThan(RECOVERY_MS);
    expect(afterRecovery.length).toBeGreaterThan(20);
    expect(afterRecovery.filter((c) => !ok(c)).map((c) => ({ status: c.status, at: c.startedAt - t0 }))).toEqual([]);
    // Submissions acknowledged both before the kill and after the recovery, so both sides are exercised.
    expect(acked.filter((t) => t < killedAt).length).toBeGreaterThan(10);
    expect(acked.filter((t) => t > upAt).length).toBeGreaterThan(10);

    // ---- every acknowledged submission is in the database, with its score and its answers
    const sequelize = createSequelize(dbUrl);
    try {
      const rows = await sequelize.query<{ id: number; scorePct: string | number | null; passed: number | null; submittedAt: Date | null; answers: number }>(
        `SELECT qa.id, qa.scorePct, qa.passed, qa.submittedAt, (SELECT COUNT(*) FROM quiz_answers a WHERE a.attemptId = qa.id) AS answers
           FROM quiz_attempts qa WHERE qa.id IN (:ids)`,
        { replacements: { ids: [...acks.keys()] }, type: QueryTypes.SELECT },
      );
      const byId = new Map(rows.map((r) => [Number(r.id), r]));
      const missing: unknown[] = [];
      for (const ack of acks.values()) {
        const row = byId.get(ack.attemptId);
        const ok =
          row &&
          row.submittedAt !== null &&
          Number(row.scorePct) === ack.scorePct &&
          Boolean(row.passed) === ack.passed &&
          Number(row.answers) === ack.questions;
        if (!ok) missing.push({ ack, row });
      }
      expect(missing).toEqual([]);
      expect(rows).toHaveLength(acks.size);
    } finally {
      await sequelize.close();
    }
  });
});

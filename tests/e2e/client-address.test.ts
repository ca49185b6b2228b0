// The demo's setup (scripts/demo.sh): the app (`next start`) listens on loopback only and nginx,
// rendered from scripts/cluster/nginx.conf, stands in front of it and writes X-Forwarded-For itself.
// A client cannot choose its own address for the per-address throttles: four verification checks
// through nginx claiming four addresses share one limit, and the app takes no connection on any
// address but loopback. A second app of the browser tests' build, with a limit of 3 per window.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Sequelize } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createSequelize } from '../../lib/db';
import { waitForOk } from '../../lib/migrator';
import { startAppServer, stopAppServer } from '../../scripts/app-server';
import { ensureNginx, freePort, writeNginxConfig } from '../../scripts/cluster/nginx';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
// A serial of the right shape that names no certificate: each check answers 404 until the limit.
const SERIAL = '0000000000000000';
const LIMIT = 3;
let app: ChildProcess | undefined;
let nginx: ChildProcess | undefined;
let work: string;
let appPort: number;
let base: string;
let sequelize: Sequelize;

const clearBuckets = () => sequelize.query("DELETE FROM rate_limits WHERE bucket IN ('verify:127.0.0.1', 'verify:::1') OR bucket LIKE 'verify:203.0.113.%'");

/** The local addresses the app was started on in /proc/net/tcp{,6} (LISTEN sockets of its port), as hex. */
function listeningAddresses(port: number): string[] {
  const hexPort = port.toString(16).toUpperCase().padStart(4, '0');
  return ['/proc/net/tcp', '/proc/net/tcp6'].flatMap((file) =>
    fs
      .readFileSync(file, 'utf8')
      .split('\n')
      .slice(1)
      .map((line) => line.trim().split(/\s+/))
      // Columns: sl, local_address (ADDR:PORT), rem_address, st (0A = LISTEN), ...
      .filter((cols) => cols[3] === '0A' && cols[1]?.endsWith(`:${hexPort}`))
      .map((cols) => cols[1].split(':')[0]),
  );
}

beforeAll(async () => {
  const databaseUrl = process.env.E2E_DATABASE_URL;
  if (!databaseUrl) throw new Error('E2E_DATABASE_URL is not set: the e2e global setup did not run');
  const distDir = process.env.E2E_DIST_DIR ?? '.next-e2e';
  if (!fs.existsSync(path.join(root, distDir, 'BUILD_ID'))) throw new Error(`no production build in ${distDir}: the e2e global setup makes it`);
  sequelize = createSequelize(databaseUrl, { poolMax: 1 });
  await clearBuckets();
  appPort = await freePort();
  const nginxPort = await freePort();
  base = `http://127.0.0.1:${nginxPort}`;
  app = startAppServer(appPort, {
    ...process.env,
    NEXT_TELEMETRY_DISABLED: '1',
    NEXT_DIST_DIR: distDir,
    DATABASE_URL: databaseUrl,
    NEXTAUTH_URL: base,
    APP_URL: base,
    NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? 'e2e-secret-0123456789abcdef',
    VERIFY_MAX_PER_ADDRESS: String(LIMIT),
  });
  work = fs.mkdtempSync(path.join(os.tmpdir(), 'brinewright-address-'));
  const conf = writeNginxConfig({ dir: work, port: nginxPort, upstreams: [`127.0.0.1:${appPort}`] });
  nginx = spawn(ensureNginx(), ['-c', conf, '-p', work], { stdio: ['ignore', 'inherit', 'inherit'] });
  await waitForOk(`http://127.0.0.1:${appPort}/api/health`, 60_000);
  await waitForOk(`${base}/api/health`, 20_000);
}, 120_000);

afterAll(async () => {
  await stopAppServer(app);
  if (nginx && nginx.exitCode === null) {
    const exited = new Promise((r) => nginx!.once('exit', r));
    nginx.kill('SIGTERM');
    await exited;
  }
  if (work) fs.rmSync(work, { recursive: true, force: true });
  if (sequelize) {
    await clearBuckets();
    await sequelize.close();
  }
});

describe('the client address in the demo’s setup (nginx in front of the app on loopback)', () => {
  it('the rendered configuration is one nginx itself accepts (nginx -t)', () => {
    const check = spawnSync(ensureNginx(), ['-t', '-c', path.join(work, 'nginx.conf'), '-p', work, '-e', path.join(work, 'error.log')], { encoding: 'utf8' });
    expect(check.stderr).toContain('test is successful');
    expect(check.status).toBe(0);
  });

  it('the app listens on 127.0.0.1 only, so every client comes through nginx', () => {
    // 0100007F is 127.0.0.1 in /proc/net/tcp's little-endian hex; no wildcard (00000000, ::) socket.
    expect(listeningAddresses(appPort)).toEqual(['0100007F']);
  });

  it('X-Forwarded-For from the client is not believed: checks "from" four addresses share one limit', async () => {
    const statuses: number[] = [];
    for (let i = 1; i <= LIMIT + 1; i++) {
      const response = await fetch(`${base}/api/certificates/${SERIAL}`, { headers: { 'x-forwarded-for': `203.0.113.${i}`, 'x-real-ip': `203.0.113.${i}` } });
      await response.arrayBuffer();
      statuses.push(response.status);
    }
    // The serial is checked (400 when malformed, 404 when unknown) until nginx's view of the
    // client (127.0.0.1) has used its 3 checks; the fourth is refused whatever address it claims.
    expect(statuses.slice(0, LIMIT).every((s) => s === 400 || s === 404)).toBe(true);
    expect(statuses[LIMIT]).toBe(429);
    const [rows] = (await sequelize.query("SELECT bucket, hits FROM rate_limits WHERE bucket LIKE 'verify:203.0.113.%' OR bucket IN ('verify:127.0.0.1')")) as [
      { bucket: string; hits: number }[],
      unknown,
    ];
    expect(rows).toEqual([{ bucket: 'verify:127.0.0.1', hits: LIMIT + 1 }]);
  });
});

// The app server without a trusted proxy (TRUST_PROXY unset, the default): a client that reaches
// it directly cannot choose its own address for the per-address throttles by sending
// X-Forwarded-For. A second app server (server.ts) of the browser tests' build on a free port, with
// a verification limit of 3 per window; the browser tests' own server trusts its callers (they
// stand where a proxy would) and is not used here.
import type { ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Sequelize } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createSequelize } from '../../lib/db';
import { waitForOk } from '../../lib/migrator';
import { startAppServer, stopAppServer } from '../../scripts/app-server';
import { freePort } from '../../scripts/cluster/nginx';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
// A serial of the right shape that names no certificate: each check answers 404 until the limit.
const SERIAL = '0000000000000000';
const LIMIT = 3;
let app: ChildProcess | undefined;
let base: string;
let sequelize: Sequelize;

const clearBuckets = () => sequelize.query("DELETE FROM rate_limits WHERE bucket IN ('verify:127.0.0.1', 'verify:::1') OR bucket LIKE 'verify:203.0.113.%'");

beforeAll(async () => {
  const databaseUrl = process.env.E2E_DATABASE_URL;
  if (!databaseUrl) throw new Error('E2E_DATABASE_URL is not set: the e2e global setup did not run');
  const distDir = process.env.E2E_DIST_DIR ?? '.next-e2e';
  if (!fs.existsSync(path.join(root, distDir, 'BUILD_ID'))) throw new Error(`no production build in ${distDir}: the e2e global setup makes it`);
  sequelize = createSequelize(databaseUrl, { poolMax: 1 });
  await clearBuckets();
  const port = await freePort();
  base = `http://127.0.0.1:${port}`;
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: 'production',
    NEXT_TELEMETRY_DISABLED: '1',
    NEXT_DIST_DIR: distDir,
    DATABASE_URL: databaseUrl,
    NEXTAUTH_URL: base,
    APP_URL: base,
    NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? 'e2e-secret-0123456789abcdef',
    VERIFY_MAX_PER_ADDRESS: String(LIMIT),
  };
  delete env.TRUST_PROXY;
  app = startAppServer(port, env);
  await waitForOk(`${base}/api/health`, 60_000);
}, 120_000);

afterAll(async () => {
  await stopAppServer(app);
  if (sequelize) {
    await clearBuckets();
    await sequelize.close();
  }
});

describe('the client address without a trusted proxy', () => {
  it('X-Forwarded-For from the client is not believed: checks "from" four addresses share one limit', async () => {
    const statuses: number[] = [];
    for (let i = 1; i <= LIMIT + 1; i++) {
      const response = await fetch(`${base}/api/certificates/${SERIAL}`, { headers: { 'x-forwarded-for': `203.0.113.${i}`, 'x-real-ip': `203.0.113.${i}` } });
      await response.arrayBuffer();
      statuses.push(response.status);
    }
    // The serial is checked (400 when malformed, 404 when unknown) until the connection's own
    // address has used its 3 checks; the fourth is refused whatever address it claims.
    expect(statuses.slice(0, LIMIT).every((s) => s === 400 || s === 404)).toBe(true);
    expect(statuses[LIMIT]).toBe(429);
    const [rows] = (await sequelize.query("SELECT bucket, hits FROM rate_limits WHERE bucket LIKE 'verify:%' AND (bucket LIKE 'verify:203.0.113.%' OR bucket IN ('verify:127.0.0.1'))")) as [{ bucket: string; hits: number }[], unknown];
    expect(rows).toEqual([{ bucket: 'verify:127.0.0.1', hits: LIMIT + 1 }]);
  });
});

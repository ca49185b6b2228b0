import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { rebuildDatabase, waitForOk } from '../../lib/migrator';
import { startAppServer } from '../../scripts/app-server';
import { e2eStatePath, writeE2eState } from './e2e-state';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
let server: ChildProcess | undefined;
let build: ChildProcess | undefined;
const services: ChildProcess[] = [];

/** `next build` without blocking this process's event loop (vitest runs the other projects meanwhile). */
function runBuild(env: NodeJS.ProcessEnv): Promise<void> {
  return new Promise((resolve, reject) => {
    build = spawn(path.join(root, 'node_modules/.bin/next'), ['build'], { cwd: root, env, stdio: 'inherit' });
    build.once('error', reject);
    build.once('exit', (code, signal) => (code === 0 ? resolve() : reject(new Error(`next build failed for the browser tests (${signal ?? `exit ${code}`})`))));
  });
}

// Browser tests run against a production build on its own port and its own database,
// migrated and seeded with the demo program like `npm run demo`.
export default async function setup() {
  const url = process.env.E2E_DATABASE_URL;
  if (!url) throw new Error('E2E_DATABASE_URL is not set: run the tests through `npm test` (scripts/test.sh).');
  await rebuildDatabase(url, { allowed: /^brinewright_e2e\w*$/, purpose: 'browser tests', seed: true });

  const port = Number(process.env.E2E_PORT ?? 3100);
  const baseUrl = `http://127.0.0.1:${port}`;
  const distDir = process.env.E2E_DIST_DIR ?? '.next-e2e';
  const env = {
    ...process.env,
    NODE_ENV: 'production' as const,
    NEXT_TELEMETRY_DISABLED: '1',
    // Types are checked by `npm run typecheck` (in CI); the tests' build only needs the bundle.
    BRINEWRIGHT_SKIP_TYPECHECK: '1',
    NEXT_DIST_DIR: distDir,
    DATABASE_URL: url,
    NEXTAUTH_URL: baseUrl,
    APP_URL: baseUrl,
    NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? 'e2e-secret-0123456789abcdef',
  };
  // The local fakes (payments, SMTP + mailbox) and the worker, on ports derived from E2E_PORT so
  // several checkouts can run browser tests side by side.
  Object.assign(env, {
    STRIPE_API_HOST: '127.0.0.1',
    STRIPE_API_PORT: String(port + 1),
    STRIPE_API_PROTOCOL: 'http',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(port + 2),
    FAKE_MAILBOX_PORT: String(port + 3),
    MAILBOX_URL: `http://127.0.0.1:${port + 3}`,
    FAKE_PAYMENTS_WEBHOOK_URL: `${baseUrl}/api/webhooks/payments`,
    FAKE_PAYMENTS_RETRY_MS: '500',
    WORKER_POLL_MS: '300',
    WORKER_BACKOFF_MS: '1000',
    BRINEWRIGHT_PARENT_PID: String(process.pid),
  });
  const tsx = path.join(root, 'node_modules/.bin/tsx');
  process.once('exit', () => services.forEach((child) => child.kill('SIGTERM')));
  services.push(spawn(tsx, ['scripts/fakes.ts'], { cwd: root, env, stdio: ['ignore', 'inherit', 'inherit'] }));
  services.push(spawn(tsx, ['--conditions=react-server', 'scripts/worker.ts'], { cwd: root, env, stdio: ['ignore', 'ignore', 'inherit'] }));
  await waitForOk(`http://127.0.0.1:${port + 1}/_fake/health`, 30_000);
  process.env.E2E_MAILBOX_URL = `http://127.0.0.1:${port + 3}`;
  process.env.E2E_PAYMENTS_URL = `http://127.0.0.1:${port + 1}`;
  process.env.E2E_BASE_URL = baseUrl;

  // The build and the app start run in the background: the browser files come last (vitest.config.mts,
  // sequence.groupOrder), so the unit, component and integration tests run meanwhile, and
  // tests/setup/e2e.ts holds each browser file until the state file says the app answers.
  const statePath = e2eStatePath(port);
  fs.rmSync(statePath, { force: true });
  const ready = (async () => {
    if (process.env.E2E_SKIP_BUILD !== '1' || !fs.existsSync(path.join(root, distDir, 'BUILD_ID'))) await runBuild(env);
    build = undefined;
    server = startAppServer(port, env, { stdio: ['ignore', 'inherit', 'inherit'] });
    await waitForOk(`${baseUrl}/api/health`, 60_000);
    // For tests that read the server's memory (/proc/<pid> and its children).
    writeE2eState(statePath, { status: 'ready', pid: server.pid! });
  })().catch((error: unknown) => writeE2eState(statePath, { status: 'failed', message: error instanceof Error ? error.message : String(error) }));

  return async () => {
    build?.kill('SIGTERM');
    await ready;
    server?.kill('SIGTERM');
    for (const child of services) child.kill('SIGTERM');
  };
}

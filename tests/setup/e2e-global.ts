import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { rebuildDatabase, waitForOk } from '../../lib/migrator';
import { startAppServer } from '../../scripts/app-server';
import { e2eSlotPort, e2eStatePath, writeE2eState } from './e2e-state';
import { slotCount, slotDatabaseUrl, slotList } from './slots';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const servers: ChildProcess[] = [];
let build: ChildProcess | undefined;
let stopping = false;
const services: ChildProcess[] = [];

/** `next build` without blocking this process's event loop (vitest runs the other projects meanwhile). */
function runBuild(env: NodeJS.ProcessEnv): Promise<void> {
  return new Promise((resolve, reject) => {
    build = spawn(path.join(root, 'node_modules/.bin/next'), ['build'], { cwd: root, env, stdio: 'inherit' });
    build.once('error', reject);
    build.once('exit', (code, signal) => (code === 0 ? resolve() : reject(new Error(`next build failed for the browser tests (${signal ?? `exit ${code}`})`))));
  });
}

/** One slot's app environment: its database, and its fakes and worker on ports derived from the slot's port. */
function slotEnv(port: number, databaseUrl: string, distDir: string): NodeJS.ProcessEnv {
  const baseUrl = `http://127.0.0.1:${port}`;
  return {
    ...process.env,
    NODE_ENV: 'production' as const,
    NEXT_TELEMETRY_DISABLED: '1',
    // Types are checked by `npm run typecheck` (in CI); the tests' build only needs the bundle.
    BRINEWRIGHT_SKIP_TYPECHECK: '1',
    NEXT_DIST_DIR: distDir,
    DATABASE_URL: databaseUrl,
    NEXTAUTH_URL: baseUrl,
    APP_URL: baseUrl,
    NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? 'e2e-secret-0123456789abcdef',
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
  };
}

// Browser tests run against a production build, one app per slot (E2E_WORKERS, 2 by default) on its
// own port and its own database, migrated and seeded with the demo program like `npm run demo`, so
// browser files run side by side without seeing each other's sign-ins, throttles or e-mails.
export default async function setup() {
  const url = process.env.E2E_DATABASE_URL;
  if (!url) throw new Error('E2E_DATABASE_URL is not set: run the tests through `npm test` (scripts/test.sh).');
  const basePort = Number(process.env.E2E_PORT ?? 3100);
  const distDir = process.env.E2E_DIST_DIR ?? '.next-e2e';
  const slots = slotList(slotCount('E2E_WORKERS')).map((slot) => {
    const port = e2eSlotPort(basePort, slot);
    const databaseUrl = slotDatabaseUrl(url, slot);
    return { slot, port, databaseUrl, env: slotEnv(port, databaseUrl, distDir) };
  });
  for (const { port } of slots) fs.rmSync(e2eStatePath(port), { force: true });
  const tsx = path.join(root, 'node_modules/.bin/tsx');
  process.once('exit', () => [...services, ...servers].forEach((child) => child.kill('SIGTERM')));

  // Everything else runs in the background: the browser files come last in their group
  // (tests/setup/sequencer.ts), so the other tests run meanwhile, and tests/setup/e2e.ts holds each
  // browser file until its slot's state file says the app answers (or why it did not start).
  // First each slot's database (migrated and seeded: the build may read it), then the build, and
  // beside it each slot's fakes (payments, SMTP + mailbox) and worker; then each slot's app.
  const ready = (async () => {
    await Promise.all(slots.map(({ databaseUrl }) => rebuildDatabase(databaseUrl, { allowed: /^brinewright_e2e\w*$/, purpose: 'browser tests', seed: true })));
    if (stopping) return;
    const reuse = process.env.E2E_SKIP_BUILD === '1' && fs.existsSync(path.join(root, distDir, 'BUILD_ID'));
    const built = reuse ? Promise.resolve() : runBuild(slots[0].env);
    built.catch(() => undefined); // awaited below, after the fakes
    for (const { env } of slots) {
      services.push(spawn(tsx, ['scripts/fakes.ts'], { cwd: root, env, stdio: ['ignore', 'inherit', 'inherit'] }));
      services.push(spawn(tsx, ['--conditions=react-server', 'scripts/worker.ts'], { cwd: root, env, stdio: ['ignore', 'ignore', 'inherit'] }));
    }
    await Promise.all(slots.map(({ port }) => waitForOk(`http://127.0.0.1:${port + 1}/_fake/health`, 60_000)));
    await built;
    build = undefined;
    await Promise.all(
      slots.map(async ({ port, env }) => {
        const server = startAppServer(port, env, { stdio: ['ignore', 'inherit', 'inherit'] });
        servers.push(server);
        try {
          await waitForOk(`http://127.0.0.1:${port}/api/health`, 60_000);
          // For tests that read the server's memory (/proc/<pid> and its children).
          writeE2eState(e2eStatePath(port), { status: 'ready', pid: server.pid! });
        } catch (error) {
          writeE2eState(e2eStatePath(port), { status: 'failed', message: error instanceof Error ? error.message : String(error) });
        }
      }),
    );
  })().catch((error: unknown) => {
    for (const { port } of slots) writeE2eState(e2eStatePath(port), { status: 'failed', message: error instanceof Error ? error.message : String(error) });
  });

  return async () => {
    stopping = true;
    build?.kill('SIGTERM');
    await ready;
    for (const child of [...servers, ...services]) child.kill('SIGTERM');
  };
}

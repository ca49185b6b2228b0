// Starts and stops the app (`next start` on loopback, behind nginx) as a child process: the one way
// `npm start`, the demos, the benchmarks and the browser tests run it.
//   tsx scripts/app-server.ts [--port 3001] [--hostname 127.0.0.1]    (npm start; PORT works too)
import { spawn, type ChildProcess, type StdioOptions } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { getEnv } from '../lib/env';
import { refuseDemoSettings } from '../lib/production-check';

const root = path.resolve(__dirname, '..');
const nextBin = path.join(root, 'node_modules/next/dist/bin/next');

// Longer than nginx's upstream keep-alive (60 s), so the app never closes a connection the proxy is about to reuse.
export const KEEP_ALIVE_TIMEOUT_MS = 65_000;

export type AppServerOptions = {
  /** Default: 127.0.0.1 (the app listens on loopback behind nginx, and for tests and benchmarks). */
  hostname?: string;
  stdio?: StdioOptions;
  /** Run under `node --cpu-prof` and write the profile into this folder when the app stops. */
  cpuProfDir?: string;
};

/** The arguments of `next start` for a port and a hostname. */
export function nextStartArgs(port: number, hostname = '127.0.0.1'): string[] {
  return ['start', '--port', String(port), '--hostname', hostname, '--keepAliveTimeout', String(KEEP_ALIVE_TIMEOUT_MS)];
}

/** `next start --port <port> --hostname <hostname>`; env decides the build (NEXT_DIST_DIR). */
export function startAppServer(port: number, env: NodeJS.ProcessEnv, options: AppServerOptions = {}): ChildProcess {
  const stdio = options.stdio ?? ['ignore', 'ignore', 'inherit'];
  const profile: string[] = [];
  if (options.cpuProfDir) {
    fs.mkdirSync(options.cpuProfDir, { recursive: true });
    profile.push('--cpu-prof', `--cpu-prof-dir=${options.cpuProfDir}`);
  }
  return spawn(process.execPath, [...profile, nextBin, ...nextStartArgs(port, options.hostname)], { cwd: root, env, stdio });
}

/** Stops the app and waits for it to exit (at most 15 s), so that a CPU profile gets written. */
export async function stopAppServer(app: ChildProcess | undefined): Promise<void> {
  if (!app || app.exitCode !== null || app.signalCode !== null) return;
  const exited = new Promise<void>((r) => app.once('exit', () => r()));
  app.kill('SIGTERM');
  await Promise.race([exited, new Promise((r) => setTimeout(r, 15_000))]);
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(__filename)) {
  const { values } = parseArgs({ options: { port: { type: 'string', short: 'p' }, hostname: { type: 'string', short: 'H' } } });
  // Demo secrets and the local payment fake are refused in production before Next starts
  // (lib/production-check.ts; instrumentation.ts checks again for a bare `next start`).
  try {
    refuseDemoSettings(getEnv(), process.env, 'The app server');
  } catch (error) {
    console.error(error instanceof Error ? error.message : String(error));
    process.exit(2);
  }
  const app = startAppServer(Number(values.port ?? process.env.PORT ?? 3001), process.env, { hostname: values.hostname, stdio: 'inherit' });
  const stop = () => void stopAppServer(app);
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
  app.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
}

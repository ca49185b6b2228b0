// Starts and stops the production server (server.ts, what `npm start` runs) as a child process:
// the one way the benchmarks and the browser tests run the app.
import { spawn, type ChildProcess, type StdioOptions } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

const root = path.resolve(__dirname, '..');

export type AppServerOptions = {
  /** Default: 127.0.0.1 (servers for tests and benchmarks listen on loopback only). */
  hostname?: string;
  stdio?: StdioOptions;
  /** Run under `node --cpu-prof` and write the profile(s) into this folder when the server stops. */
  cpuProfDir?: string;
};

/** `tsx server.ts --port <port> --hostname <hostname>`; env decides the build (NEXT_DIST_DIR) and WEB_CONCURRENCY. */
export function startAppServer(port: number, env: NodeJS.ProcessEnv, options: AppServerOptions = {}): ChildProcess {
  const serverArgs = ['server.ts', '--port', String(port), '--hostname', options.hostname ?? '127.0.0.1'];
  const stdio = options.stdio ?? ['ignore', 'ignore', 'inherit'];
  if (!options.cpuProfDir) return spawn(path.join(root, 'node_modules/.bin/tsx'), serverArgs, { cwd: root, env, stdio });
  fs.mkdirSync(options.cpuProfDir, { recursive: true });
  // node refuses --cpu-prof in NODE_OPTIONS; with several workers each writes its own profile.
  return spawn(process.execPath, ['--cpu-prof', `--cpu-prof-dir=${options.cpuProfDir}`, '--import', 'tsx', ...serverArgs], { cwd: root, env, stdio });
}

/** Stops the server and waits for it to exit (at most 15 s), so that a CPU profile gets written. */
export async function stopAppServer(app: ChildProcess | undefined): Promise<void> {
  if (!app || app.exitCode !== null || app.signalCode !== null) return;
  const exited = new Promise<void>((r) => app.once('exit', () => r()));
  app.kill('SIGTERM');
  await Promise.race([exited, new Promise((r) => setTimeout(r, 15_000))]);
}

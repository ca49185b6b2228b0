// Shared by the benchmarks that run the production server: starting it (optionally under
// `node --cpu-prof`), stopping it so that a profile gets written, and the CPU time it used.
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

const root = path.resolve(__dirname, '..');

/** `next start` on 127.0.0.1:port; with cpuProfDir, under `node --cpu-prof` (node refuses that flag in NODE_OPTIONS). */
export function startNext(port: number, env: NodeJS.ProcessEnv, cpuProfDir?: string): ChildProcess {
  const args = ['start', '-p', String(port), '-H', '127.0.0.1'];
  const stdio: ['ignore', 'ignore', 'inherit'] = ['ignore', 'ignore', 'inherit'];
  if (!cpuProfDir) return spawn(path.join(root, 'node_modules/.bin/next'), args, { cwd: root, env, stdio });
  fs.mkdirSync(cpuProfDir, { recursive: true });
  return spawn(process.execPath, ['--cpu-prof', `--cpu-prof-dir=${cpuProfDir}`, path.join(root, 'node_modules/next/dist/bin/next'), ...args], { cwd: root, env, stdio });
}

/** Stops the server and waits (at most 15 s) for it to exit, so that a CPU profile is written. */
export async function stopAndWait(app: ChildProcess): Promise<void> {
  if (app.exitCode !== null || app.signalCode !== null) return;
  const exited = new Promise<void>((r) => app.once('exit', () => r()));
  app.kill('SIGTERM');
  await Promise.race([exited, new Promise((r) => setTimeout(r, 15_000))]);
}

/**
 * CPU time (user + system, ms) used so far by a process and its descendants, from /proc. Divided
 * by the requests served it gives the server's CPU cost per request, a figure that a busy machine
 * disturbs far less than requests per second or latency.
 */
export function cpuMsOfTree(pid: number): number {
  const tick = 1000 / Number(execFileSync('getconf', ['CLK_TCK'], { encoding: 'utf8' }).trim() || 100);
  let total = 0;
  const visit = (p: number) => {
    try {
      // Fields after the command name (which may hold spaces): utime and stime are the 12th and 13th.
      const stat = fs.readFileSync(`/proc/${p}/stat`, 'utf8');
      const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
      total += (Number(fields[11]) + Number(fields[12])) * tick;
    } catch {
      return; // gone
    }
    const children = fs.existsSync(`/proc/${p}/task/${p}/children`) ? fs.readFileSync(`/proc/${p}/task/${p}/children`, 'utf8').trim() : '';
    for (const c of children.split(/\s+/).filter(Boolean)) visit(Number(c));
  };
  visit(pid);
  return total;
}

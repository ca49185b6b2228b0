// Shared by the benchmarks that run the production server (started and stopped with
// scripts/app-server.ts): the CPU time it used.
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';

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

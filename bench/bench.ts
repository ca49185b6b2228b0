// npm run bench — runs every benchmark script of the project (every `bench:*` line in package.json,
// so a new one is included without touching this file) one after the other, with one shared
// production build, and writes a Markdown report: bench-results/REPORT.md (and a dated copy).
//
// Each bench script may write machine-readable figures with writeBenchResults() from
// bench/bench-results.ts; this script points it at bench-results/runs/<name>.json through
// BENCH_RESULTS_FILE. For a script that writes none, the report quotes its JSON output (the last
// JSON object it printed, or bench-results/<name>.json) and every output line that states a goal.
//
// Environment: BENCH_ONLY=pages,grading (a subset), BENCH_DIST_DIR (.next-bench, the shared build),
// BENCH_BUILD=1 (rebuild even when the build exists), BENCH_SCRIPT_TIMEOUT_S (420 per script),
// BENCH_REPORT (bench-results/REPORT.md).
import { execFileSync, spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { BenchFigure, BenchResults } from './bench-results';

const root = path.resolve(__dirname, '..');
const resultsDir = path.join(root, 'bench-results');
const runsDir = path.join(resultsDir, 'runs');
const distDir = process.env.BENCH_DIST_DIR ?? '.next-bench';
const timeoutS = Number(process.env.BENCH_SCRIPT_TIMEOUT_S ?? 420);
const reportFile = path.resolve(root, process.env.BENCH_REPORT ?? 'bench-results/REPORT.md');
const log = (message: string) => process.stdout.write(`[bench:all] ${message}\n`);
const la = (l: number[]) => l.map((n) => n.toFixed(2)).join(' ');

type Run = {
  name: string;
  script: string;
  seconds: number;
  exitCode: number | null;
  timedOut: boolean;
  results: BenchResults | null;
  fallbackJson: unknown;
  goalLines: string[];
  tail: string[];
  loadBefore: number[];
  loadAfter: number[];
};

/** Every `bench:<name>` script in package.json, in the order they are written. */
export function discoverBenchScripts(pkg: { scripts?: Record<string, string> }): { name: string; script: string }[] {
  return Object.entries(pkg.scripts ?? {})
    .filter(([key]) => key.startsWith('bench:'))
    .map(([key, script]) => ({ name: key.slice('bench:'.length), script }));
}

/** The last top-level JSON object printed in a script's output (a multi-line JSON.stringify(…, null, 2) too). */
export function lastJsonObject(output: string): unknown {
  const lines = output.split('\n');
  for (let end = lines.length - 1; end >= 0; end--) {
    if (lines[end].trim() !== '}') continue;
    for (let start = end; start >= 0; start--) {
      if (!lines[start].startsWith('{')) continue;
      try {
        return JSON.parse(lines.slice(start, end + 1).join('\n'));
      } catch {
        // not this opening brace
      }
    }
  }
  for (let i = lines.length - 1; i >= 0; i--) {
    const line = lines[i].trim();
    if (line.startsWith('{') && line.endsWith('}')) {
      try {
        return JSON.parse(line);
      } catch {
        // not JSON
      }
    }
  }
  return null;
}

function gitCommit(): string {
  try {
    const sha = execFileSync('git', ['rev-parse', '--short', 'HEAD'], { cwd: root, encoding: 'utf8' }).trim();
    const dirty = execFileSync('git', ['status', '--porcelain', '--untracked-files=no'], { cwd: root, encoding: 'utf8' }).trim();
    return dirty ? `${sha} (with uncommitted changes)` : sha;
  } catch {
    return 'unknown';
  }
}

function ensureSharedBuild(): number {
  const started = Date.now();
  if (process.env.BENCH_BUILD !== '1' && fs.existsSync(path.join(root, distDir, 'BUILD_ID'))) {
    log(`reusing the production build in ${distDir} (BENCH_BUILD=1 rebuilds)`);
    return 0;
  }
  log(`one production build for every bench script: next build into ${distDir}`);
  const build = spawnSync(path.join(root, 'node_modules/.bin/next'), ['build'], {
    cwd: root,
    stdio: 'inherit',
    env: { ...process.env, NODE_ENV: 'production', BRINEWRIGHT_DEMO: '1', NEXT_TELEMETRY_DISABLED: '1', NEXT_DIST_DIR: distDir },
  });
  if (build.status !== 0) throw new Error('next build failed');
  return (Date.now() - started) / 1000;
}

function runScript(name: string, script: string): Promise<Run> {
  const resultsFile = path.join(runsDir, `${name}.json`);
  fs.rmSync(resultsFile, { force: true });
  const loadBefore = os.loadavg();
  const started = Date.now();
  log(`bench:${name} — ${script}`);
  return new Promise((resolve) => {
    const child = spawn('npm', ['run', '--silent', `bench:${name}`], {
      cwd: root,
      detached: true,
      stdio: ['ignore', 'pipe', 'pipe'],
      env: {
        ...process.env,
        BENCH_RESULTS_FILE: resultsFile,
        BENCH_DIST_DIR: distDir,
        // The build above is shared: scripts that would rebuild on their own reuse it.
        BENCH_SKIP_BUILD: '1',
        BENCH_BUILD: '0',
      },
    });
    const stop = () => {
      if (child.pid && child.exitCode === null) process.kill(-child.pid, 'SIGTERM');
      process.exit(130);
    };
    process.once('SIGINT', stop);
    process.once('SIGTERM', stop);
    let output = '';
    const take = (chunk: Buffer) => {
      const text = chunk.toString('utf8');
      output += text;
      process.stdout.write(text.replace(/^(?=.)/gm, `  ${name} | `));
    };
    child.stdout.on('data', take);
    child.stderr.on('data', take);
    let timedOut = false;
    const timer = setTimeout(() => {
      timedOut = true;
      log(`bench:${name} is over ${timeoutS} s: stopping it`);
      if (child.pid) process.kill(-child.pid, 'SIGTERM');
      setTimeout(() => child.pid && child.exitCode === null && process.kill(-child.pid, 'SIGKILL'), 10_000).unref();
    }, timeoutS * 1000);
    child.on('close', (exitCode) => {
      clearTimeout(timer);
      process.off('SIGINT', stop);
      process.off('SIGTERM', stop);
      let results: BenchResults | null = null;
      if (fs.existsSync(resultsFile)) {
        try {
          results = JSON.parse(fs.readFileSync(resultsFile, 'utf8')) as BenchResults;
        } catch {
          results = null;
        }
      }
      let fallbackJson: unknown = null;
      if (!results) {
        fallbackJson = lastJsonObject(output);
        const own = path.join(resultsDir, `${name}.json`);
        if (!fallbackJson && fs.existsSync(own) && fs.statSync(own).mtimeMs >= started) {
          try {
            fallbackJson = JSON.parse(fs.readFileSync(own, 'utf8'));
          } catch {
            fallbackJson = null;
          }
        }
      }
      const lines = output.split('\n').map((l) => l.trimEnd());
      resolve({
        name,
        script,
        seconds: (Date.now() - started) / 1000,
        exitCode,
        timedOut,
        results,
        fallbackJson,
        goalLines: lines.filter((l) => /\bgoal\b|\bmet\b/i.test(l)).slice(-12),
        tail: lines.filter(Boolean).slice(-15),
        loadBefore,
        loadAfter: os.loadavg(),
      });
    });
  });
}

const num = (n: number | undefined, digits = 2) => (n === undefined || !Number.isFinite(n) ? '–' : Math.abs(n) >= 100 ? n.toFixed(0) : n.toFixed(digits));
const cell = (s: string) => s.replace(/\|/g, '\\|');

export function figureRow(bench: string, f: BenchFigure): string {
  const anchor = f.anchor ? `${cell(f.anchor.name)}: ${num(f.anchor.value)} ${f.anchor.unit ?? f.unit}` : '–';
  const met = f.met === undefined ? '–' : f.met ? 'met' : '**not met**';
  return `| ${bench} | ${cell(f.name)} | ${num(f.value)} ${f.unit} | ${anchor} | ${f.ratio === undefined ? '–' : `${num(f.ratio)}×`} | ${cell(f.goal ?? '–')} | ${met} |`;
}

function report(runs: Run[], facts: { started: Date; totalS: number; buildS: number; loadBefore: number[]; loadAfter: number[] }): string {
  const cpus = os.cpus();
  const out: string[] = [];
  out.push(`# Brinewright benchmarks — ${facts.started.toISOString().slice(0, 16).replace('T', ' ')} UTC`, '');
  out.push('Written by `npm run bench` (bench/bench.ts). Every figure is from this one run on this machine.', '');
  out.push('## Machine', '');
  out.push(
    `- ${os.availableParallelism()} cores (${cpus[0]?.model ?? 'unknown CPU'}), ${(os.totalmem() / 1024 ** 3).toFixed(1)} GB memory, ${os.type()} ${os.release()}`,
  );
  out.push(`- Node ${process.version}; commit ${gitCommit()}`);
  out.push(
    `- load average (1, 5, 15 min): ${la(facts.loadBefore)} before, ${la(facts.loadAfter)} after` +
      (facts.loadBefore[0] > os.availableParallelism() ? ' — the machine was busy with other work: figures are noisy and low' : ''),
  );
  out.push(`- total time ${(facts.totalS / 60).toFixed(1)} min (shared build ${facts.buildS ? `${facts.buildS.toFixed(0)} s` : 'reused'})`, '');
  out.push('## Figures', '');
  out.push('| bench | figure | value | anchor | ratio | goal | |', '| --- | --- | --- | --- | --- | --- | --- |');
  for (const run of runs) {
    if (run.results) for (const f of run.results.figures) out.push(figureRow(run.name, f));
    else out.push(`| ${run.name} | (no machine-readable figures; see below) | – | – | – | – | – |`);
  }
  out.push('');
  out.push('## Runs', '');
  for (const run of runs) {
    const status = run.timedOut ? `stopped after ${timeoutS} s` : run.exitCode === 0 ? 'finished' : `failed (exit ${run.exitCode})`;
    out.push(`### bench:${run.name}`, '');
    out.push(`\`${run.script}\` — ${status} in ${run.seconds.toFixed(0)} s; load average ${la(run.loadBefore)} before, ${la(run.loadAfter)} after.`, '');
    for (const note of run.results?.notes ?? []) out.push(`- ${note}`);
    if (run.results?.notes?.length) out.push('');
    if (!run.results && run.fallbackJson) out.push('Its JSON output:', '', '```json', JSON.stringify(run.fallbackJson, null, 2), '```', '');
    if (!run.results && run.goalLines.length) out.push('Its lines about goals:', '', '```', ...run.goalLines, '```', '');
    if (run.exitCode !== 0 || run.timedOut) out.push('Last lines of its output:', '', '```', ...run.tail, '```', '');
  }
  return out.join('\n') + '\n';
}

async function main() {
  const started = new Date();
  const pkg = JSON.parse(fs.readFileSync(path.join(root, 'package.json'), 'utf8')) as { scripts?: Record<string, string> };
  const only = process.env.BENCH_ONLY?.split(',')
    .map((s) => s.trim())
    .filter(Boolean);
  const scripts = discoverBenchScripts(pkg).filter((s) => !only || only.includes(s.name));
  if (!scripts.length) throw new Error('no bench:* scripts to run');
  log(`${scripts.length} bench scripts: ${scripts.map((s) => s.name).join(', ')}`);
  const loadBefore = os.loadavg();
  fs.mkdirSync(runsDir, { recursive: true });
  const buildS = ensureSharedBuild();
  const runs: Run[] = [];
  for (const s of scripts) runs.push(await runScript(s.name, s.script));
  const totalS = (Date.now() - started.getTime()) / 1000;
  const text = report(runs, { started, totalS, buildS, loadBefore, loadAfter: os.loadavg() });
  fs.mkdirSync(path.dirname(reportFile), { recursive: true });
  fs.writeFileSync(reportFile, text);
  const dated = path.join(resultsDir, `${started.toISOString().slice(0, 16).replace(/[:T]/g, '-')}.md`);
  fs.writeFileSync(dated, text);
  process.stdout.write('\n' + text);
  log(`report: ${path.relative(root, reportFile)} (and ${path.relative(root, dated)})`);
  log(`total time ${(totalS / 60).toFixed(1)} min`);
  if (runs.some((r) => r.exitCode !== 0 || r.timedOut)) process.exitCode = 1;
}

if (require.main === module) {
  main().catch((error) => {
    console.error(`[bench:all] ${(error as Error).message}`);
    process.exit(1);
  });
}

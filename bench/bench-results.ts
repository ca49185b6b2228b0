// Machine-readable results of the benchmark scripts, collected by `npm run bench` (bench/bench.ts)
// into one Markdown report. A bench script calls writeBenchResults() once at the end; the file goes
// to $BENCH_RESULTS_FILE when bench.ts set it, otherwise to bench-results/<bench>.json.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

export type BenchFigure = {
  /** What was measured, e.g. "public lesson, app (next start)". */
  name: string;
  value: number;
  /** req/s, ms, s, MB, … */
  unit: string;
  /** The yardstick the figure is compared with (e.g. nginx serving the same file). */
  anchor?: { name: string; value: number; unit?: string };
  /** value / anchor.value (or the ratio the goal is stated in). */
  ratio?: number;
  /** The goal in words, e.g. "≥ 0.5× nginx". */
  goal?: string;
  met?: boolean;
};

export type BenchResults = {
  bench: string;
  finishedAt: string;
  loadAverage?: { before?: number[]; after?: number[] };
  figures: BenchFigure[];
  notes?: string[];
};

export function benchResultsFile(bench: string): string {
  return process.env.BENCH_RESULTS_FILE || path.resolve(__dirname, '..', 'bench-results', `${bench}.json`);
}

export function writeBenchResults(results: Omit<BenchResults, 'finishedAt'>): string {
  const file = benchResultsFile(results.bench);
  fs.mkdirSync(path.dirname(file), { recursive: true });
  const full: BenchResults = { ...results, finishedAt: new Date().toISOString() };
  if (!full.loadAverage) full.loadAverage = { after: os.loadavg() };
  fs.writeFileSync(file, JSON.stringify(full, null, 2) + '\n');
  return file;
}

/** One figure with its ratio to an anchor; `higherIsBetter` decides how the goal ratio is read. */
export function ratioFigure(
  name: string,
  value: number,
  unit: string,
  anchor: { name: string; value: number },
  goalRatio: number,
  higherIsBetter = true,
): BenchFigure {
  const ratio = value / anchor.value;
  return {
    name,
    value,
    unit,
    anchor: { ...anchor, unit },
    ratio,
    goal: `${higherIsBetter ? '≥' : '≤'} ${goalRatio}× ${anchor.name}`,
    met: higherIsBetter ? ratio >= goalRatio : ratio <= goalRatio,
  };
}

import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { ratioFigure, writeBenchResults } from '../../bench/bench-results';
import { discoverBenchScripts, figureRow, lastJsonObject } from '../../bench/bench';

describe('npm run bench (bench/bench.ts)', () => {
  it('discovers every bench:* script of package.json, and only those', () => {
    const found = discoverBenchScripts({ scripts: { bench: 'tsx bench/bench.ts', 'bench:pages': 'a', test: 'b', 'bench:new-one': 'c', benchmark: 'd' } });
    expect(found).toEqual([
      { name: 'pages', script: 'a' },
      { name: 'new-one', script: 'c' },
    ]);
  });

  it('includes every bench:* script the real package.json has', () => {
    const pkg = JSON.parse(fs.readFileSync(path.resolve(__dirname, '../../package.json'), 'utf8'));
    const names = discoverBenchScripts(pkg).map((s) => s.name);
    expect(names).toEqual(expect.arrayContaining(['pages', 'grading', 'practicals', 'certificates']));
    expect(names).not.toContain('');
  });

  it('finds the last JSON object a script printed, pretty-printed or on one line', () => {
    const pretty = 'seeding…\n{\n  "issued": 500,\n  "seconds": 41.2\n}\n';
    expect(lastJsonObject(pretty)).toEqual({ issued: 500, seconds: 41.2 });
    expect(lastJsonObject('[bench] x\n{"a":1}\n{"b":2}\ndone\n')).toEqual({ b: 2 });
    expect(lastJsonObject('no json here\n{ not json }\n')).toBeNull();
  });

  it('writes a figure row with its anchor, ratio, goal and verdict', () => {
    const f = ratioFigure('lesson, app, req/s', 400, 'req/s', { name: 'nginx file', value: 4000 }, 0.5);
    expect(f.ratio).toBeCloseTo(0.1, 10);
    expect(f.met).toBe(false);
    expect(figureRow('pages', f)).toBe('| pages | lesson, app, req/s | 400 req/s | nginx file: 4000 req/s | 0.10× | ≥ 0.5× nginx file | **not met** |');
    const js = ratioFigure('first-load JS', 201, 'kB', { name: 'bare page', value: 185 }, 1.3, false);
    expect(js.met).toBe(true);
    expect(figureRow('pages', js)).toContain('| 1.09× | ≤ 1.3× bare page | met |');
  });
});

describe('writeBenchResults (bench/bench-results.ts)', () => {
  const saved = process.env.BENCH_RESULTS_FILE;
  afterEach(() => {
    if (saved === undefined) delete process.env.BENCH_RESULTS_FILE;
    else process.env.BENCH_RESULTS_FILE = saved;
  });

  it('writes to BENCH_RESULTS_FILE with the time and the load average', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'bench-results-'));
    process.env.BENCH_RESULTS_FILE = path.join(dir, 'runs', 'x.json');
    const file = writeBenchResults({ bench: 'x', figures: [{ name: 'n', value: 1, unit: 's', goal: '< 2 s', met: true }] });
    const written = JSON.parse(fs.readFileSync(file, 'utf8'));
    expect(file).toBe(process.env.BENCH_RESULTS_FILE);
    expect(written.bench).toBe('x');
    expect(written.figures).toEqual([{ name: 'n', value: 1, unit: 's', goal: '< 2 s', met: true }]);
    expect(Number.isNaN(Date.parse(written.finishedAt))).toBe(false);
    expect(written.loadAverage.after).toHaveLength(3);
    fs.rmSync(dir, { recursive: true, force: true });
  });
});

// Summarises V8 CPU profiles (.cpuprofile, as written by `node --cpu-prof`): the functions and the
// packages with the most self time. Used to find where a benchmarked request spends its time.
//   tsx bench/cpu-profile-summary.ts <file-or-folder>... [--top 25] [--inclusive fnA,fnB]
// --inclusive: for each named function, the share of busy time spent in it or below it
//   (url:<part> names every function of the files whose path contains <part>).
// --stacks fnA,fnB: the heaviest call stacks (12 frames up) leading to each named function's self time.
import fs from 'node:fs';
import path from 'node:path';

type Node = { id: number; callFrame: { functionName: string; url: string; lineNumber: number }; hitCount?: number; children?: number[] };
type Profile = { nodes: Node[]; startTime: number; endTime: number; samples: number[]; timeDeltas: number[] };

const args = process.argv.slice(2);
const topAt = args.indexOf('--top');
const TOP = topAt >= 0 ? Number(args[topAt + 1]) : 25;
const incAt = args.indexOf('--inclusive');
const INCLUSIVE = incAt >= 0 ? args[incAt + 1].split(',') : [];
const stAt = args.indexOf('--stacks');
const STACKS = stAt >= 0 ? args[stAt + 1].split(',') : [];
const optionValues = new Set([topAt, incAt, stAt].filter((i) => i >= 0).map((i) => i + 1));
const inputs = args.filter((a, i) => !a.startsWith('--') && !optionValues.has(i));
const files = inputs.flatMap((p) =>
  fs.statSync(p).isDirectory()
    ? fs
        .readdirSync(p)
        .filter((f) => f.endsWith('.cpuprofile'))
        .map((f) => path.join(p, f))
    : [p],
);
if (!files.length) {
  console.error('usage: tsx bench/cpu-profile-summary.ts <file.cpuprofile | folder>... [--top N]');
  process.exit(2);
}

/** Where a frame's code comes from: a package name, the app's own bundle, node internals or V8. */
function origin(url: string, name: string): string {
  if (!url) return name.startsWith('(') ? name : '(native)';
  const m = /node_modules\/((?:@[^/]+\/)?[^/]+)/.exec(url);
  if (m) {
    // Next's compiled copies of other packages: name the copy.
    const compiled = /next\/dist\/compiled\/((?:@[^/]+\/)?[^/]+)/.exec(url);
    return compiled ? `next/compiled/${compiled[1]}` : m[1];
  }
  if (url.startsWith('node:')) return 'node:internals';
  if (/\.next[^/]*\/server\//.test(url)) return 'app bundle (.next/server)';
  return path.basename(url);
}

for (const file of files) {
  const profile = JSON.parse(fs.readFileSync(file, 'utf8')) as Profile;
  const byId = new Map(profile.nodes.map((n) => [n.id, n]));
  const self = new Map<number, number>();
  profile.samples.forEach((id, i) => self.set(id, (self.get(id) ?? 0) + (profile.timeDeltas[i] ?? 0)));
  const totalUs = profile.endTime - profile.startTime;
  const fns = new Map<string, number>();
  const pkgs = new Map<string, number>();
  for (const [id, us] of self) {
    const { callFrame: f } = byId.get(id)!;
    const key = `${f.functionName || '(anonymous)'}  ${f.url ? `${f.url.replace(/^.*node_modules\//, '').replace(/^file:\/\/.*?\/(\.next[^/]*)/, '$1')}:${f.lineNumber + 1}` : ''}`;
    fns.set(key, (fns.get(key) ?? 0) + us);
    const o = origin(f.url, f.functionName);
    pkgs.set(o, (pkgs.get(o) ?? 0) + us);
  }
  const idle = [...fns].filter(([k]) => k.startsWith('(idle)')).reduce((a, [, v]) => a + v, 0);
  const busy = totalUs - idle;
  const pct = (us: number) => `${((100 * us) / busy).toFixed(1).padStart(5)} %`;
  console.log(
    `\n${path.basename(file)}: ${(totalUs / 1e6).toFixed(1)} s profiled, ${(busy / 1e6).toFixed(1)} s busy (${((100 * busy) / totalUs).toFixed(0)} %); shares below are of busy time`,
  );
  console.log('  by origin:');
  for (const [k, v] of [...pkgs]
    .filter(([k]) => k !== '(idle)')
    .sort((a, b) => b[1] - a[1])
    .slice(0, 15))
    console.log(`   ${pct(v)}  ${(v / 1000).toFixed(0).padStart(7)} ms  ${k}`);
  if (INCLUSIVE.length) {
    const parent = new Map<number, number>();
    for (const n of profile.nodes) for (const c of n.children ?? []) parent.set(c, n.id);
    console.log('  inclusive (the function and everything it calls):');
    for (const name of INCLUSIVE) {
      let us = 0;
      for (const [id, t] of self) {
        for (let cur: number | undefined = id; cur !== undefined; cur = parent.get(cur)) {
          const f = byId.get(cur)!.callFrame;
          // A name starting with "url:" matches frames by file instead (minified bundles).
          if (name.startsWith('url:') ? f.url.includes(name.slice(4)) : f.functionName === name) {
            us += t;
            break;
          }
        }
      }
      console.log(`   ${pct(us)}  ${(us / 1000).toFixed(0).padStart(7)} ms  ${name}`);
    }
  }
  if (STACKS.length) {
    const parent = new Map<number, number>();
    for (const n of profile.nodes) for (const c of n.children ?? []) parent.set(c, n.id);
    const frame = (id: number) => {
      const f = byId.get(id)!.callFrame;
      return `${f.functionName || '(anon)'}@${f.url.replace(/^.*node_modules\//, '').replace(/^.*\/(\.next[^/]*)\//, '$1/')}:${f.lineNumber + 1}`;
    };
    for (const name of STACKS) {
      const stacks = new Map<string, number>();
      for (const [id, t] of self) {
        if (byId.get(id)!.callFrame.functionName !== name) continue;
        const chain: string[] = [];
        for (let cur = parent.get(id); cur !== undefined && chain.length < 12; cur = parent.get(cur)) chain.push(frame(cur));
        const key = chain.join(' < ');
        stacks.set(key, (stacks.get(key) ?? 0) + t);
      }
      console.log(`  stacks of ${name}:`);
      for (const [k, v] of [...stacks].sort((a, b) => b[1] - a[1]).slice(0, 5)) console.log(`   ${pct(v)}  ${k}`);
    }
  }
  console.log(`  top ${TOP} functions by self time:`);
  for (const [k, v] of [...fns]
    .filter(([k]) => !k.startsWith('(idle)'))
    .sort((a, b) => b[1] - a[1])
    .slice(0, TOP))
    console.log(`   ${pct(v)}  ${(v / 1000).toFixed(0).padStart(7)} ms  ${k}`);
}

// Discovers every page, route handler and server action from the files under app/, so that the
// authorization matrix and the bad-input sweep can fail when a new one appears that they do not
// list. Pure file reading: no build, no server.
import fs from 'node:fs';
import path from 'node:path';

export type DiscoveredRoute =
  | { kind: 'page'; pattern: string; file: string }
  | { kind: 'route'; pattern: string; file: string; methods: string[] }
  | { kind: 'action'; pattern: string; file: string; actions: string[] };

const ROOT = path.resolve(__dirname, '../..');
const APP = path.join(ROOT, 'app');
const METHODS = ['GET', 'HEAD', 'POST', 'PUT', 'PATCH', 'DELETE', 'OPTIONS'];

function walk(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    return entry.isDirectory() ? walk(full) : [full];
  });
}

/** app/api/attempts/[id]/submit/route.ts → /api/attempts/[id]/submit; (groups) and @slots dropped. */
export function patternOf(file: string): string {
  const segments = path
    .relative(APP, path.dirname(file))
    .split(path.sep)
    .filter((segment) => segment && !/^\(.*\)$/.test(segment) && !segment.startsWith('@'));
  return '/' + segments.join('/');
}

function exportedMethods(source: string): string[] {
  const found = new Set<string>();
  for (const method of METHODS) {
    const declared = new RegExp(`export\\s+(?:async\\s+)?(?:function|const|let)\\s+${method}\\b`);
    const reexported = new RegExp(`export\\s*\\{[^}]*\\bas\\s+${method}\\b[^}]*\\}|export\\s*\\{[^}]*\\b${method}\\b[^}]*\\}`);
    if (declared.test(source) || reexported.test(source)) found.add(method);
  }
  return [...found];
}

function exportedFunctions(source: string): string[] {
  return [...source.matchAll(/export\s+(?:async\s+)?function\s+(\w+)/g)].map((match) => match[1]);
}

export function discoverRoutes(): DiscoveredRoute[] {
  const files = walk(APP).filter((file) => /\.(tsx?|jsx?)$/.test(file) && !/\.test\.tsx?$/.test(file));
  const routes: DiscoveredRoute[] = [];
  for (const file of files.sort()) {
    const base = path.basename(file).replace(/\.(tsx?|jsx?)$/, '');
    const relative = path.relative(ROOT, file);
    const source = fs.readFileSync(file, 'utf8');
    if (base === 'page') routes.push({ kind: 'page', pattern: patternOf(file), file: relative });
    else if (base === 'route') routes.push({ kind: 'route', pattern: patternOf(file), file: relative, methods: exportedMethods(source) });
    else if (/^\s*['"]use server['"]/.test(source)) {
      routes.push({ kind: 'action', pattern: patternOf(file), file: relative, actions: exportedFunctions(source) });
    }
  }
  return routes;
}

/** Fills [param] and [...param] segments from a map, e.g. fill('/api/attempts/[id]', { id: 7 }). */
export function fillPattern(pattern: string, values: Record<string, string | number>): string {
  return pattern.replace(/\[(?:\.\.\.)?(\w+)\]/g, (_, name: string) => {
    if (!(name in values)) throw new Error(`no value for [${name}] in ${pattern}`);
    return encodeURIComponent(String(values[name]));
  });
}

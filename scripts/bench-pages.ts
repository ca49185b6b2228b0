// npm run bench:pages — requests per second and p95 latency of a public lesson page and of the
// Brine bench, served by the app (`next start`) and, as the yardstick, by nginx serving the same
// HTML saved to files. Also prints the first-load JS of a lesson page against a bare page.
//
// Bounded: 50 connections (BENCH_CONNECTIONS), 10 s per run (BENCH_SECONDS), four runs plus a
// short warm-up of the app. Both servers listen on 127.0.0.1 only and are stopped at the end.
//
// Environment: BENCH_APP_PORT (3121), BENCH_NGINX_PORT (3122), BENCH_DIST_DIR (.next-bench),
// BENCH_BUILD=1 to rebuild even when a build exists, BENCH_LESSON (/learn/pickling-and-canning/acidity).
import { execFileSync, spawn, spawnSync, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import { waitForOk } from '../lib/migrator';

// eslint-disable-next-line @typescript-eslint/no-require-imports
const autocannon = require('autocannon') as (opts: object) => AutocannonInstance;
type AutocannonInstance = Promise<AutocannonResult> & { on(event: 'response', fn: (client: unknown, status: number, bytes: number, ms: number) => void): void };
type AutocannonResult = { requests: { average: number; total: number }; latency: { p50: number; p99: number }; non2xx: number; errors: number; timeouts: number; duration: number };

const root = path.resolve(__dirname, '..');
const appPort = Number(process.env.BENCH_APP_PORT ?? 3121);
const nginxPort = Number(process.env.BENCH_NGINX_PORT ?? 3122);
const seconds = Number(process.env.BENCH_SECONDS ?? 10);
const connections = Number(process.env.BENCH_CONNECTIONS ?? 50);
const distDir = process.env.BENCH_DIST_DIR ?? '.next-bench';
const lessonPath = process.env.BENCH_LESSON ?? '/learn/pickling-and-canning/acidity';
const appUrl = `http://127.0.0.1:${appPort}`;
const nginxUrl = `http://127.0.0.1:${nginxPort}`;

const children: ChildProcess[] = [];
const log = (message: string) => process.stdout.write(`[bench] ${message}\n`);

function stopAll() {
  for (const child of children) if (child.exitCode === null && child.pid) child.kill('SIGTERM');
}
process.on('exit', stopAll);
process.on('SIGINT', () => process.exit(130));

function appEnv(): NodeJS.ProcessEnv {
  const secretFile = path.join(root, '.data', 'nextauth-secret');
  const secret = fs.existsSync(secretFile) ? fs.readFileSync(secretFile, 'utf8').trim() : 'bench-secret-0123456789abcdef';
  // Both pages measured are static; the database is only named so the app's configuration check passes.
  const databaseUrl =
    process.env.DATABASE_URL ?? execFileSync('bash', [path.join(root, 'scripts/db.sh'), 'url', 'brinewright'], { encoding: 'utf8' }).trim();
  return {
    ...process.env,
    NODE_ENV: 'production',
    NEXT_TELEMETRY_DISABLED: '1',
    NEXT_DIST_DIR: distDir,
    DATABASE_URL: databaseUrl,
    NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? secret,
    NEXTAUTH_URL: appUrl,
    APP_URL: appUrl,
  };
}

function ensureBuild(env: NodeJS.ProcessEnv) {
  if (process.env.BENCH_BUILD !== '1' && fs.existsSync(path.join(root, distDir, 'BUILD_ID'))) {
    log(`reusing the build in ${distDir} (BENCH_BUILD=1 rebuilds)`);
    return;
  }
  log(`building into ${distDir}`);
  const build = spawnSync(path.join(root, 'node_modules/.bin/next'), ['build'], { cwd: root, env, stdio: 'inherit' });
  if (build.status !== 0) throw new Error('next build failed');
}

function ensureNginx(): string {
  const found = ['/usr/sbin/nginx', '/usr/bin/nginx'].find((p) => fs.existsSync(p));
  if (found) return found;
  log("nginx is missing: installing Debian's nginx package");
  execFileSync('apt-get', ['install', '-y', '-qq', 'nginx'], { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
  return '/usr/sbin/nginx';
}

function startNginx(nginx: string, dir: string) {
  const conf = path.join(dir, 'nginx.conf');
  fs.writeFileSync(
    conf,
    `# Written by scripts/bench-pages.ts: static files on loopback, no logging.
${process.getuid?.() === 0 ? 'user root;' : ''}
daemon off;
worker_processes ${os.availableParallelism()};
pid ${dir}/nginx.pid;
error_log ${dir}/error.log warn;
events { worker_connections 1024; }
http {
  access_log off;
  types { text/html html; }
  client_body_temp_path ${dir}/tmp-body;
  proxy_temp_path ${dir}/tmp-proxy;
  fastcgi_temp_path ${dir}/tmp-fastcgi;
  uwsgi_temp_path ${dir}/tmp-uwsgi;
  scgi_temp_path ${dir}/tmp-scgi;
  server {
    listen 127.0.0.1:${nginxPort};
    root ${dir}/www;
    location / { try_files $uri =404; }
  }
}
`,
  );
  const child = spawn(nginx, ['-c', conf, '-p', dir], { stdio: ['ignore', 'inherit', 'inherit'] });
  children.push(child);
  return child;
}

function percentile(sorted: number[], p: number) {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

type Run = { label: string; rps: number; p95: number; p50: number; total: number; bad: number };

async function load(label: string, url: string, duration = seconds): Promise<Run> {
  const times: number[] = [];
  const instance = autocannon({ url, connections, duration });
  instance.on('response', (_client, status, _bytes, ms) => {
    if (status >= 200 && status < 300) times.push(ms);
  });
  const result = await instance;
  times.sort((a, b) => a - b);
  return {
    label,
    rps: result.requests.average,
    p95: percentile(times, 95),
    p50: percentile(times, 50),
    total: result.requests.total,
    bad: result.non2xx + result.errors + result.timeouts,
  };
}

/** The JS a browser loads before the page is interactive: every script and script preload in the HTML. */
async function firstLoadJs(pagePath: string) {
  const html = await (await fetch(appUrl + pagePath)).text();
  const urls = new Set<string>();
  for (const m of html.matchAll(/<script[^>]*\ssrc="([^"]+)"/g)) urls.add(m[1]);
  for (const m of html.matchAll(/<link[^>]*rel="(?:preload|modulepreload)"[^>]*>/g)) {
    const tag = m[0];
    if (/as="script"/.test(tag) || /modulepreload/.test(tag)) {
      const href = /href="([^"]+)"/.exec(tag)?.[1];
      if (href) urls.add(href);
    }
  }
  let raw = 0;
  let gzip = 0;
  for (const u of urls) {
    const body = Buffer.from(await (await fetch(new URL(u.replace(/&amp;/g, '&'), appUrl))).arrayBuffer());
    raw += body.length;
    gzip += zlib.gzipSync(body, { level: 9 }).length;
  }
  return { files: urls.size, raw, gzip, urls: [...urls] };
}

const kb = (n: number) => `${(n / 1024).toFixed(1)} kB`;

async function main() {
  const env = appEnv();
  ensureBuild(env);
  const nginx = ensureNginx();
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'brinewright-bench-'));
  fs.mkdirSync(path.join(dir, 'www'));

  log(`starting the app on ${appUrl}`);
  const app = spawn(path.join(root, 'node_modules/.bin/next'), ['start', '-p', String(appPort), '-H', '127.0.0.1'], { cwd: root, env, stdio: ['ignore', 'ignore', 'inherit'] });
  children.push(app);
  await waitForOk(appUrl + lessonPath, 60_000);

  const pages = [
    { name: 'lesson', path: lessonPath, file: 'lesson.html' },
    { name: 'bench', path: '/bench', file: 'bench.html' },
  ];
  for (const page of pages) {
    const response = await fetch(appUrl + page.path);
    if (!response.ok) throw new Error(`${page.path} answered ${response.status}`);
    fs.writeFileSync(path.join(dir, 'www', page.file), await response.text());
  }
  startNginx(nginx, dir);
  await waitForOk(`${nginxUrl}/lesson.html`, 10_000);

  log('first-load JS (every <script src> and script preload in the HTML, sizes as served and gzip -9)');
  const bare = await firstLoadJs('/');
  const rows = [
    ['bare page (/)', bare],
    [`lesson (${lessonPath})`, await firstLoadJs(lessonPath)],
    ['Brine bench (/bench)', await firstLoadJs('/bench')],
  ] as const;
  for (const [name, js] of rows) {
    log(`  ${name.padEnd(48)} ${String(js.files).padStart(3)} files  ${kb(js.raw).padStart(10)}  gzip ${kb(js.gzip).padStart(9)}  ${(js.gzip / bare.gzip).toFixed(2)}× bare`);
  }

  const load1 = () => os.loadavg().map((n) => n.toFixed(1)).join(' ');
  log(`load average before the runs: ${load1()} on ${os.availableParallelism()} cores (other work on the machine lowers the app's figures far more than nginx's)`);
  log(`warming the app up (2 s per page)`);
  for (const page of pages) await load('warm-up', appUrl + page.path, 2);

  const results: Run[] = [];
  for (const page of pages) {
    log(`${page.name}: app, ${connections} connections, ${seconds} s`);
    results.push(await load(`${page.name} app`, appUrl + page.path));
    log(`${page.name}: nginx, ${connections} connections, ${seconds} s`);
    results.push(await load(`${page.name} nginx`, `${nginxUrl}/${page.file}`));
  }

  log(`load average after the runs: ${load1()}`);
  log('');
  log(`${'run'.padEnd(14)} ${'req/s'.padStart(9)} ${'p50 ms'.padStart(8)} ${'p95 ms'.padStart(8)} ${'requests'.padStart(9)} ${'not 2xx'.padStart(8)}`);
  for (const r of results) {
    log(`${r.label.padEnd(14)} ${r.rps.toFixed(0).padStart(9)} ${r.p50.toFixed(0).padStart(8)} ${r.p95.toFixed(0).padStart(8)} ${String(r.total).padStart(9)} ${String(r.bad).padStart(8)}`);
  }
  for (const page of pages) {
    const appRun = results.find((r) => r.label === `${page.name} app`)!;
    const nginxRun = results.find((r) => r.label === `${page.name} nginx`)!;
    const ratio = appRun.rps / nginxRun.rps;
    log(`${page.name}: app/nginx requests per second = ${ratio.toFixed(2)}× (goal ≥ 0.50×) ${ratio >= 0.5 ? 'met' : 'NOT met'}`);
  }
  stopAll();
  fs.rmSync(dir, { recursive: true, force: true });
}

main().catch((error) => {
  console.error(`[bench] ${(error as Error).message}`);
  stopAll();
  process.exit(1);
});

// npm run bench:pages — requests per second and p95 latency of a public lesson page and of the
// Brine bench, served by the app (`next start`, what `npm start` runs) and, as the yardstick, by nginx serving the same
// HTML saved to files. Also prints the first-load JS of a lesson page against a bare page.
//
// With BENCH_TARGET containing `cluster` (the default is `direct,cluster`) it also measures the
// deployment path: the same pages through nginx as a reverse proxy in front of the app, once with
// the proxy alone and once with the short micro-cache for anonymous GETs of public pages that
// scripts/cluster/nginx.conf uses. Those figures are nginx's cache, not the app: they are printed
// and reported apart from the app's own.
//
// Bounded: 50 connections (BENCH_CONNECTIONS), 10 s per run (BENCH_SECONDS), four runs (eight with
// the cluster target) plus a short warm-up of the app. Every server listens on 127.0.0.1 only and
// is stopped at the end. Neither the app nor nginx compresses here: autocannon sends no
// Accept-Encoding, so both serve the same uncompressed bytes.
//
// Environment: BENCH_APP_PORT (3121), BENCH_NGINX_PORT (3122; the proxy takes a free port),
// BENCH_DIST_DIR (.next-bench), BENCH_BUILD=1 to rebuild even when a build exists, BENCH_LESSON
// (/learn/pickling-and-canning/acidity), BENCH_TARGET (direct,cluster). Results also go to
// bench-results/pages.json (or $BENCH_RESULTS_FILE) for `npm run bench`.
import { execFileSync, spawn, spawnSync, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import { waitForOk } from '../lib/migrator';
import { ratioFigure, writeBenchResults, type BenchFigure } from './bench-results';
import { cpuMsOfTree } from './bench-support';
import { ensureNginx, freePort } from '../scripts/cluster/nginx';
import { startAppServer } from '../scripts/app-server';

// eslint-disable-next-line @typescript-eslint/no-require-imports
const autocannon = require('autocannon') as (opts: object) => AutocannonInstance;
type AutocannonInstance = Promise<AutocannonResult> & { on(event: 'response', fn: (client: unknown, status: number, bytes: number, ms: number) => void): void };
type AutocannonResult = {
  requests: { average: number; total: number };
  latency: { p50: number; p99: number };
  non2xx: number;
  errors: number;
  timeouts: number;
  duration: number;
};

const root = path.resolve(__dirname, '..');
const appPort = Number(process.env.BENCH_APP_PORT ?? 3121);
const nginxPort = Number(process.env.BENCH_NGINX_PORT ?? 3122);
const seconds = Number(process.env.BENCH_SECONDS ?? 10);
const connections = Number(process.env.BENCH_CONNECTIONS ?? 50);
const distDir = process.env.BENCH_DIST_DIR ?? '.next-bench';
const lessonPath = process.env.BENCH_LESSON ?? '/learn/pickling-and-canning/acidity';
const targets = (process.env.BENCH_TARGET ?? 'direct,cluster').split(',').map((t) => t.trim());
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
  // Neither page reads the database for a signed-out visitor; it is only named so the configuration check passes.
  const databaseUrl = process.env.DATABASE_URL ?? execFileSync('bash', [path.join(root, 'scripts/db.sh'), 'url', 'brinewright'], { encoding: 'utf8' }).trim();
  return {
    ...process.env,
    NODE_ENV: 'production',
    BRINEWRIGHT_DEMO: '1',
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

/**
 * The reverse proxy of the deployment (scripts/cluster/nginx.conf) in front of the one app server:
 * `/plain/…` passes every request through, `/` adds the micro-cache (anonymous GETs of public
 * pages for a few seconds; never a request with a session cookie or an Authorization header,
 * never a router (RSC) request, never a response with Set-Cookie or a private / no-store
 * Cache-Control, never /api except the public /api/tools).
 */
function proxyServer(dir: string, proxyPort: number) {
  return `
  proxy_cache_path ${dir}/cache levels=1:2 keys_zone=brinewright_pages:10m max_size=100m inactive=1m use_temp_path=off;
  map $http_cookie $brinewright_has_session { default 0; "~*next-auth\.session-token" 1; }
  map $upstream_http_cache_control $brinewright_private { default 0; "~*(private|no-store|no-cache)" 1; }
  upstream brinewright_bench_app { server 127.0.0.1:${appPort}; keepalive 32; }
  server {
    listen 127.0.0.1:${proxyPort};
    proxy_http_version 1.1;
    proxy_set_header Connection "";
    proxy_set_header Host $http_host;
    location /plain/ {
      rewrite ^/plain(/.*)$ $1 break;
      proxy_pass http://brinewright_bench_app;
    }
    location /api/ { proxy_pass http://brinewright_bench_app; }
    location / {
      proxy_pass http://brinewright_bench_app;
      proxy_cache brinewright_pages;
      proxy_cache_methods GET HEAD;
      proxy_cache_key $scheme$http_host$request_uri$http_accept_encoding;
      proxy_ignore_headers Cache-Control Expires;
      proxy_cache_valid 200 5s;
      proxy_cache_bypass $brinewright_has_session $http_authorization $http_rsc $http_next_router_prefetch $http_next_router_state_tree;
      proxy_no_cache $brinewright_has_session $http_authorization $http_rsc $http_next_router_prefetch $http_next_router_state_tree $upstream_http_set_cookie $brinewright_private;
      proxy_cache_lock on;
      proxy_cache_use_stale updating;
      proxy_cache_background_update on;
      add_header X-Cache $upstream_cache_status always;
    }
    location /api/tools/ {
      proxy_pass http://brinewright_bench_app;
      proxy_cache brinewright_pages;
      proxy_cache_key $scheme$http_host$request_uri$http_accept_encoding;
      proxy_ignore_headers Cache-Control Expires;
      proxy_cache_valid 200 5s;
      proxy_cache_bypass $brinewright_has_session $http_authorization;
      proxy_no_cache $brinewright_has_session $http_authorization $upstream_http_set_cookie $brinewright_private;
      add_header X-Cache $upstream_cache_status always;
    }
  }
`;
}

function startNginx(nginx: string, dir: string, proxyPort: number | null) {
  const conf = path.join(dir, 'nginx.conf');
  fs.writeFileSync(
    conf,
    `# Written by bench/bench-pages.ts: static files on loopback, no logging.
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
${proxyPort ? proxyServer(dir, proxyPort) : ''}}
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

type Run = { label: string; rps: number; p95: number; p50: number; total: number; bad: number; appCpuMs: number; nginxCpuMs: number };

/** The processes whose CPU time each run measures (the app server, nginx with its workers). */
const measured: { app?: number; nginx?: number } = {};
const cpuOf = (pid?: number) => (pid ? cpuMsOfTree(pid) : 0);

async function load(label: string, url: string, duration = seconds): Promise<Run> {
  const times: number[] = [];
  const appCpuBefore = cpuOf(measured.app);
  const nginxCpuBefore = cpuOf(measured.nginx);
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
    // Server CPU per request: a busy machine disturbs it far less than requests per second.
    appCpuMs: (cpuOf(measured.app) - appCpuBefore) / Math.max(1, result.requests.total),
    nginxCpuMs: (cpuOf(measured.nginx) - nginxCpuBefore) / Math.max(1, result.requests.total),
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
  const app = startAppServer(appPort, env);
  children.push(app);
  measured.app = app.pid;
  await waitForOk(appUrl + lessonPath, 60_000);

  const warnings: string[] = [];
  const pages = [
    { name: 'lesson', path: lessonPath, file: 'lesson.html' },
    { name: 'bench', path: '/bench', file: 'bench.html' },
  ];
  for (const page of pages) {
    const response = await fetch(appUrl + page.path);
    if (!response.ok) throw new Error(`${page.path} answered ${response.status}`);
    const html = await response.text();
    fs.writeFileSync(path.join(dir, 'www', page.file), html);
  }
  const proxyPort = targets.includes('cluster') ? await freePort() : null;
  const proxyUrl = `http://127.0.0.1:${proxyPort}`;
  measured.nginx = startNginx(nginx, dir, proxyPort).pid;
  await waitForOk(`${nginxUrl}/lesson.html`, 10_000);
  if (proxyPort) await waitForOk(`${proxyUrl}${lessonPath}`, 10_000);

  log('first-load JS (every <script src> and script preload in the HTML, sizes as served and gzip -9)');
  const bare = await firstLoadJs('/');
  const rows = [
    ['bare page (/)', bare],
    [`lesson (${lessonPath})`, await firstLoadJs(lessonPath)],
    ['Brine bench (/bench)', await firstLoadJs('/bench')],
  ] as const;
  for (const [name, js] of rows) {
    log(
      `  ${name.padEnd(48)} ${String(js.files).padStart(3)} files  ${kb(js.raw).padStart(10)}  gzip ${kb(js.gzip).padStart(9)}  ${(js.gzip / bare.gzip).toFixed(2)}× bare`,
    );
  }

  const load1 = () =>
    os
      .loadavg()
      .map((n) => n.toFixed(1))
      .join(' ');
  const loadBefore = os.loadavg();
  log(
    `load average before the runs: ${load1()} on ${os.availableParallelism()} cores (other work on the machine lowers the app's figures far more than nginx's)`,
  );
  log(`warming the app up (2 s per page)`);
  for (const page of pages) await load('warm-up', appUrl + page.path, 2);

  const results: Run[] = [];
  for (const page of pages) {
    log(`${page.name}: app, ${connections} connections, ${seconds} s`);
    results.push(await load(`${page.name} app`, appUrl + page.path));
    log(`${page.name}: nginx, ${connections} connections, ${seconds} s`);
    results.push(await load(`${page.name} nginx`, `${nginxUrl}/${page.file}`));
  }
  if (proxyPort) {
    for (const page of pages) {
      log(`${page.name}: through the nginx reverse proxy, no cache, ${connections} connections, ${seconds} s`);
      results.push(await load(`${page.name} via-proxy`, `${proxyUrl}/plain${page.path}`));
      log(`${page.name}: through nginx with the micro-cache, ${connections} connections, ${seconds} s`);
      results.push(await load(`${page.name} microcache`, `${proxyUrl}${page.path}`));
    }
  }

  log(`load average after the runs: ${load1()}`);
  log('');
  log(
    `${'run'.padEnd(18)} ${'req/s'.padStart(9)} ${'p50 ms'.padStart(8)} ${'p95 ms'.padStart(8)} ${'requests'.padStart(9)} ${'not 2xx'.padStart(8)} ${'app CPU ms/req'.padStart(15)} ${'nginx CPU ms/req'.padStart(17)}`,
  );
  for (const r of results) {
    log(
      `${r.label.padEnd(18)} ${r.rps.toFixed(0).padStart(9)} ${r.p50.toFixed(0).padStart(8)} ${r.p95.toFixed(0).padStart(8)} ${String(r.total).padStart(9)} ${String(r.bad).padStart(8)} ${r.appCpuMs.toFixed(3).padStart(15)} ${r.nginxCpuMs.toFixed(3).padStart(17)}`,
    );
  }
  const figures: BenchFigure[] = [];
  const find = (label: string) => results.find((r) => r.label === label);
  for (const page of pages) {
    const appRun = find(`${page.name} app`)!;
    const nginxRun = find(`${page.name} nginx`)!;
    const ratio = appRun.rps / nginxRun.rps;
    log(`${page.name}: app/nginx requests per second = ${ratio.toFixed(2)}× (goal ≥ 0.50×) ${ratio >= 0.5 ? 'met' : 'NOT met'}`);
    const anchor = { name: 'nginx serving the same HTML from a file', value: nginxRun.rps };
    figures.push({ ...ratioFigure(`${page.path}: the app alone (next start), req/s`, appRun.rps, 'req/s', anchor, 0.5) });
    const cpuRatio = nginxRun.nginxCpuMs / appRun.appCpuMs;
    // nginx's share of one core during its run: far below 1, the load generator (autocannon, one
    // JavaScript thread on the same machine) set the pace, and the req/s ratio says little.
    const nginxBusy = (nginxRun.nginxCpuMs * nginxRun.rps) / 1000;
    if (nginxBusy < 0.5) {
      const note = `${page.path}: nginx used ${(nginxBusy * 100).toFixed(0)}% of a core while answering ${nginxRun.rps.toFixed(0)} req/s — the load generator, not nginx, set that pace, so the req/s ratio understates nginx; the CPU-per-request ratio is the fairer comparison`;
      log(`NOTE ${note}`);
      warnings.push(note);
    }
    log(
      `${page.name}: server CPU per request, app ${appRun.appCpuMs.toFixed(3)} ms, nginx ${nginxRun.nginxCpuMs.toFixed(3)} ms: nginx's/app's = ${cpuRatio.toFixed(2)}× (less disturbed by other work than req/s)`,
    );
    figures.push({
      name: `${page.path}: the app alone, server CPU per request`,
      value: appRun.appCpuMs,
      unit: 'ms',
      anchor: { name: 'nginx serving the file', value: nginxRun.nginxCpuMs, unit: 'ms' },
      ratio: cpuRatio,
      goal: 'ratio = nginx CPU ÷ app CPU (≥ 0.5 would match the req/s goal)',
      met: cpuRatio >= 0.5,
    });
    figures.push({ name: `${page.path}: the app alone, p95`, value: appRun.p95, unit: 'ms', anchor: { name: 'nginx, p95', value: nginxRun.p95, unit: 'ms' } });
  }
  for (const page of pages) {
    const nginxRun = find(`${page.name} nginx`)!;
    const anchor = { name: 'nginx serving the same HTML from a file', value: nginxRun.rps };
    const via = find(`${page.name} via-proxy`);
    const cached = find(`${page.name} microcache`);
    if (via) {
      const ratio = via.rps / nginxRun.rps;
      log(`${page.name}: through the nginx proxy (no cache)/nginx file = ${ratio.toFixed(2)}× — still the app's own speed, plus a hop`);
      figures.push({
        name: `${page.path}: app through the nginx reverse proxy, no cache, req/s`,
        value: via.rps,
        unit: 'req/s',
        anchor,
        ratio,
        goal: 'for comparison',
      });
    }
    if (cached) {
      const ratio = cached.rps / nginxRun.rps;
      log(`${page.name}: through nginx with the 5 s micro-cache/nginx file = ${ratio.toFixed(2)}× — nginx's cache answering, NOT the app's own figure`);
      figures.push({
        name: `${page.path}: deployment path, nginx micro-cache (5 s) in front of the app, req/s — nginx's cache, not the app`,
        value: cached.rps,
        unit: 'req/s',
        anchor,
        ratio,
        goal: '≥ 0.5× (deployment path)',
        met: ratio >= 0.5,
      });
      figures.push({
        name: `${page.path}: deployment path, CPU per request (nginx + app)`,
        value: cached.nginxCpuMs + cached.appCpuMs,
        unit: 'ms',
        anchor: { name: 'nginx serving the file', value: nginxRun.nginxCpuMs, unit: 'ms' },
      });
    }
  }
  const lessonJs = rows[1][1];
  const benchJs = rows[2][1];
  figures.push(
    ratioFigure(
      `first-load JS of ${lessonPath} (gzip)`,
      lessonJs.gzip / 1024,
      'kB',
      { name: 'a bare page of the app (/)', value: bare.gzip / 1024 },
      1.3,
      false,
    ),
  );
  figures.push(
    ratioFigure('first-load JS of /bench (gzip)', benchJs.gzip / 1024, 'kB', { name: 'a bare page of the app (/)', value: bare.gzip / 1024 }, 1.3, false),
  );
  const file = writeBenchResults({
    bench: 'pages',
    loadAverage: { before: loadBefore, after: os.loadavg() },
    figures,
    notes: [
      ...warnings.map((w) => `${w}.`),
      `${connections} connections, ${seconds} s a run, autocannon on the same machine (it takes CPU from both servers); no Accept-Encoding, so neither side compresses.`,
      `HTML sizes: ${pages.map((p) => `${p.path} ${kb(fs.statSync(path.join(dir, 'www', p.file)).size)}`).join(', ')}.`,
      ...results.map(
        (r) => `${r.label}: ${r.rps.toFixed(0)} req/s, p50 ${r.p50.toFixed(0)} ms, p95 ${r.p95.toFixed(0)} ms, ${r.total} requests, ${r.bad} not 2xx`,
      ),
    ],
  });
  log(`results: ${path.relative(root, file)}`);
  stopAll();
  fs.rmSync(dir, { recursive: true, force: true });
}

main().catch((error) => {
  console.error(`[bench] ${(error as Error).message}`);
  stopAll();
  process.exit(1);
});

// Benchmark of quiz grading (not a test): 50 connections for 20 s submitting graded attempts to the
// app (production build on a loopback port, its own database), then the same load against a bare
// node:http handler doing the app's one INSERT (the quiz_answers rows) through a mariadb pool of
// the same size. Prints requests/s, p95 and the ratio. Goals: >= 0.5x the bare handler, p95 < 100 ms.
// Two floors under the same load, for reading the ratio: the app's health route (one SELECT 1, no
// session) and a calculator route (no session, no database), which is what Next itself costs.
// The app is one `next start` process, like the bare handler (several processes go behind nginx: demo:cluster).
// BENCH_CPU_PROF=<folder>: run the app under `node --cpu-prof` and write its profile there
// (summarise with `tsx bench/cpu-profile-summary.ts <folder>`).
import { spawnSync, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import * as mariadb from 'mariadb';
import { createRequire } from 'node:module';
import { createSequelize } from '../lib/db';
import { rebuildDatabase, waitForOk } from '../lib/migrator';
import { COMPUTE_FNS } from '../lib/quiz/compute';
import { drawQuestions, rightAnswer, type Answers } from '../lib/quiz/grading';
import { parseBankFile, resolveBanks } from '../lib/quiz/resolve';
import { startAppServer, stopAppServer } from '../scripts/app-server';
import { cpuMsOfTree } from './bench-support';
import { ratioFigure, writeBenchResults } from './bench-results';

const root = path.resolve(__dirname, '..');
// autocannon ships no type declarations; the part used here is typed loosely.
type Instance = { on: (event: 'response', fn: (client: unknown, status: number, bytes: number, ms: number) => void) => void };
const autocannon = createRequire(__filename)('autocannon') as (
  opts: object,
  done: (err: Error | null, result: { requests: { total: number }; errors: number; duration: number }) => void,
) => Instance;
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 50);
const DURATION_S = Number(process.env.BENCH_DURATION_S ?? 20);
const APP_PORT = Number(process.env.BENCH_PORT ?? 3151);
const BARE_PORT = APP_PORT + 1;
const DIST_DIR = process.env.BENCH_DIST_DIR ?? '.next-bench';
const POOL_MAX = Number(process.env.DB_POOL_MAX ?? 10);
const ATTEMPTS = Number(process.env.BENCH_ATTEMPTS ?? 40_000);
const CPU_PROF = process.env.BENCH_CPU_PROF ? path.resolve(process.env.BENCH_CPU_PROF) : undefined;
const QUIZ = 'pickling-and-canning--acidity';
const TOOL_PATH = '/api/tools/convert?value=1&from=cup&to=mL';
const LEARNER = { email: 'learner@cedarhollow.example', password: 'demo-learner-pass' };

const dbUrl = process.env.BENCH_DATABASE_URL;
if (!dbUrl || !/^brinewright_bench\w*$/.test(new URL(dbUrl).pathname.slice(1))) {
  throw new Error('Run through `npm run bench:grading`: BENCH_DATABASE_URL must name a brinewright_bench* database.');
}

function percentile(values: number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] ?? NaN;
}

async function prepareDatabase() {
  await rebuildDatabase(dbUrl!, { allowed: /^brinewright_bench\w*$/, purpose: 'benchmarks', seed: true });
  const sequelize = createSequelize(dbUrl!);

  const dir = path.join(root, 'content/quizzes');
  const banks = resolveBanks(
    fs
      .readdirSync(dir)
      .filter((f) => f.endsWith('.json'))
      .map((f) => parseBankFile(JSON.parse(fs.readFileSync(path.join(dir, f), 'utf8')), f)),
    COMPUTE_FNS,
  );
  const bank = banks.get(QUIZ)!;
  const [[user]] = (await sequelize.query(
    'SELECT u.id, e.courseId FROM users u JOIN enrollments e ON e.userId = u.id JOIN courses c ON c.id = e.courseId WHERE u.email = ? AND c.slug = ?',
    {
      replacements: [LEARNER.email, 'pickling-and-canning'],
    },
  )) as [{ id: number; courseId: number }[], unknown];
  if (!user) throw new Error('The demo learner with a flagship enrollment is missing from the seed');

  // Open attempts made in bulk, each with its own draw, and the right answers for each.
  const bodies: { id: number; body: string }[] = [];
  const now = new Date();
  for (let start = 0; start < ATTEMPTS; start += 1000) {
    const rows: unknown[] = [];
    const draws = [];
    for (let i = start; i < Math.min(ATTEMPTS, start + 1000); i += 1) {
      const drawn = drawQuestions(bank.questions, bank.draw);
      draws.push(drawn);
      rows.push(user.id, user.courseId, QUIZ, JSON.stringify(drawn), now, now, now);
    }
    const [insertId] = (await sequelize.query(
      `INSERT INTO quiz_attempts (userId, courseId, quizSlug, drawn, startedAt, createdAt, updatedAt) VALUES ${draws.map(() => '(?, ?, ?, ?, ?, ?, ?)').join(', ')}`,
      { replacements: rows },
    )) as unknown as [number];
    draws.forEach((drawn, k) => {
      const answers: Answers = {};
      for (const d of drawn.questions) {
        const q = bank.questions.find((x) => x.id === d.id)!;
        const right = rightAnswer(q, d);
        answers[q.id] =
          q.kind === 'single'
            ? right.choices![0]
            : q.kind === 'multiple'
              ? right.choices!
              : q.kind === 'true-false'
                ? (right.value as boolean)
                : { value: right.value as number, unit: right.unit! };
      }
      bodies.push({ id: Number(insertId) + k, body: JSON.stringify({ answers }) });
    });
  }
  await sequelize.close();
  return { bodies, userCourseId: user.courseId, questionIds: bank.questions.map((q) => q.id) };
}

async function sessionCookie(base: string): Promise<string> {
  const csrf = await fetch(`${base}/api/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const jar = csrf.headers.getSetCookie().map((c) => c.split(';')[0]);
  const signIn = await fetch(`${base}/api/auth/callback/credentials`, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded', cookie: jar.join('; ') },
    body: new URLSearchParams({ csrfToken, email: LEARNER.email, password: LEARNER.password, json: 'true' }),
  });
  const session = signIn.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .find((c) => c.includes('session-token'));
  if (!session) throw new Error(`Sign-in failed (${signIn.status})`);
  return session;
}

type Run = { rps: number; p95: number; p50: number; requests: number; non2xx: number; errors: number; cpuMsPerRequest?: number };

function load(url: string, next: () => { path: string; body?: string }, headers: Record<string, string>, method: 'POST' | 'GET' = 'POST'): Promise<Run> {
  return new Promise((resolve, reject) => {
    const latencies: number[] = [];
    let non2xx = 0;
    const instance = autocannon(
      {
        url,
        connections: CONNECTIONS,
        duration: DURATION_S,
        requests: [
          {
            method,
            setupRequest: (req: Record<string, unknown>) => {
              const n = next();
              return {
                ...req,
                path: n.path,
                ...(n.body === undefined ? {} : { body: n.body }),
                headers: { ...headers, ...(n.body === undefined ? {} : { 'content-type': 'application/json' }) },
              };
            },
          },
        ],
      },
      (err, result) => {
        if (err) return reject(err);
        resolve({
          rps: latencies.length / result.duration,
          p95: percentile(latencies, 95),
          p50: percentile(latencies, 50),
          requests: latencies.length,
          non2xx,
          errors: result.errors,
        });
      },
    );
    instance.on('response', (_client, status, _bytes, ms) => {
      latencies.push(ms);
      if (status < 200 || status >= 300) non2xx += 1;
    });
  });
}

async function main() {
  const loadBefore = os.loadavg();
  console.log(`[bench] preparing the bench database and ${ATTEMPTS} open attempts…`);
  const { bodies, userCourseId, questionIds } = await prepareDatabase();
  const base = `http://127.0.0.1:${APP_PORT}`;
  const env = {
    ...process.env,
    NODE_ENV: 'production' as const,
    BRINEWRIGHT_DEMO: '1',
    NEXT_TELEMETRY_DISABLED: '1',
    NEXT_DIST_DIR: DIST_DIR,
    DATABASE_URL: dbUrl!,
    NEXTAUTH_URL: base,
    APP_URL: base,
    DB_POOL_MAX: String(POOL_MAX),
  };
  if (!fs.existsSync(path.join(root, DIST_DIR, 'BUILD_ID'))) {
    console.log(`[bench] building the app into ${DIST_DIR}…`);
    const build = spawnSync(path.join(root, 'node_modules/.bin/next'), ['build'], { cwd: root, env, stdio: 'inherit' });
    if (build.status !== 0) throw new Error('next build failed');
  }
  let app: ChildProcess | undefined;
  let bare: http.Server | undefined;
  let pool: mariadb.Pool | undefined;
  try {
    app = startAppServer(APP_PORT, env, { cpuProfDir: CPU_PROF });
    await waitForOk(`${base}/api/health`, 60_000);
    const cookie = await sessionCookie(base);

    // Warm-up: a few submissions so the route is compiled and the pool is open.
    let cursor = 0;
    for (let i = 0; i < 20; i += 1) {
      const b = bodies[cursor++];
      const r = await fetch(`${base}/api/attempts/${b.id}/submit`, { method: 'POST', headers: { cookie, 'content-type': 'application/json' }, body: b.body });
      if (r.status !== 200) throw new Error(`warm-up submit answered ${r.status}: ${await r.text()}`);
      const json = (await r.json()) as { attempt: { result: { passed: boolean } } };
      if (!json.attempt.result.passed) throw new Error('warm-up attempt did not pass: the bench answers are wrong');
    }
    const firstMeasured = cursor;
    console.log(`[bench] app: POST /api/attempts/:id/submit, ${CONNECTIONS} connections, ${DURATION_S} s`);
    const cpuBefore = cpuMsOfTree(app.pid!);
    const appRun = await load(
      base,
      () => {
        if (cursor >= bodies.length) throw new Error(`ran out of open attempts (${bodies.length}); raise BENCH_ATTEMPTS`);
        const b = bodies[cursor++];
        return { path: `/api/attempts/${b.id}/submit`, body: b.body };
      },
      { cookie },
    );
    const graded = cursor - firstMeasured;
    appRun.cpuMsPerRequest = (cpuMsOfTree(app.pid!) - cpuBefore) / appRun.requests;
    if (CPU_PROF) {
      await stopAppServer(app);
      console.log(`[bench] CPU profile written to ${CPU_PROF}`);
    }

    // The framework's floor, for the reading of the ratio: the app's health route, which does one
    // `SELECT 1` through the same pool and nothing else (no session, no body), under the same load.
    let floorRun: Run | undefined;
    let toolRun: Run | undefined;
    if (!CPU_PROF && process.env.BENCH_FLOOR !== '0') {
      console.log(`[bench] floor: GET /api/health through the app (one SELECT 1), same load`);
      const floorCpu = cpuMsOfTree(app.pid!);
      floorRun = await load(base, () => ({ path: '/api/health' }), {}, 'GET');
      floorRun.cpuMsPerRequest = (cpuMsOfTree(app.pid!) - floorCpu) / floorRun.requests;
      // And Next's own floor: a route handler that reads no session and no database (a calculator
      // route: parse the query with zod, one multiplication, a small JSON answer).
      console.log(`[bench] framework floor: GET ${TOOL_PATH} (no session, no database), same load`);
      const toolCpu = cpuMsOfTree(app.pid!);
      toolRun = await load(base, () => ({ path: TOOL_PATH }), {}, 'GET');
      toolRun.cpuMsPerRequest = (cpuMsOfTree(app.pid!) - toolCpu) / toolRun.requests;
    }

    // Check: every measured submission was a real grading (one stored result per attempt).
    const check = await mariadb.createConnection(poolConfig(1));
    const [{ n }] = await check.query('SELECT COUNT(*) AS n FROM quiz_attempts WHERE submittedAt IS NOT NULL AND passed = 1');
    await check.end();
    app.kill('SIGTERM');
    app = undefined;

    // The anchor: the same one INSERT (the attempt's quiz_answers rows) through a mariadb pool of the same size.
    pool = mariadb.createPool(poolConfig(POOL_MAX));
    let counter = 0;
    const [[anchor]] = [await pool.query('SELECT id FROM quiz_attempts ORDER BY id DESC LIMIT 1')] as [{ id: number }[]];
    bare = http.createServer((req, res) => {
      const chunks: Buffer[] = [];
      req.on('data', (c) => chunks.push(c));
      req.on('end', async () => {
        try {
          JSON.parse(Buffer.concat(chunks).toString('utf8'));
          counter += 1;
          const now = new Date();
          const rows = questionIds.map((q) => [anchor.id, userCourseId, null, QUIZ, `${q}-${counter}`, 1, 'c1', now]);
          await pool!.query(
            `INSERT INTO quiz_answers (attemptId, courseId, workshopId, quizSlug, questionId, correct, response, submittedAt) VALUES ${rows.map(() => '(?, ?, ?, ?, ?, ?, ?, ?)').join(', ')}`,
            rows.flat(),
          );
          res.writeHead(200, { 'content-type': 'application/json' });
          res.end('{"ok":true}');
        } catch (error) {
          res.writeHead(500);
          res.end(String(error));
        }
      });
    });
    await new Promise<void>((r) => bare!.listen(BARE_PORT, '127.0.0.1', r));
    let k = 0;
    console.log(`[bench] bare node:http + mariadb pool, same load`);
    const bareRun = await load(`http://127.0.0.1:${BARE_PORT}`, () => ({ path: '/submit', body: bodies[k++ % bodies.length].body }), {});

    const ratio = appRun.rps / bareRun.rps;
    const fmt = (r: Run) =>
      `${r.rps.toFixed(1)} req/s, p50 ${r.p50.toFixed(1)} ms, p95 ${r.p95.toFixed(1)} ms, ${r.requests} requests, ${r.non2xx} non-2xx, ${r.errors} errors${r.cpuMsPerRequest === undefined ? '' : `; server CPU ${r.cpuMsPerRequest.toFixed(2)} ms per request`}`;
    console.log('');
    console.log(`app  (graded submissions): ${fmt(appRun)}; ${graded} attempts handed out, ${Number(n)} attempts graded and passed in the database`);
    console.log(`bare (one INSERT)        : ${fmt(bareRun)}`);
    if (floorRun) console.log(`floor (app, GET /api/health, one SELECT 1): ${fmt(floorRun)}; ${(floorRun.rps / bareRun.rps).toFixed(2)}x the bare handler`);
    if (toolRun)
      console.log(
        `framework floor (app, GET ${TOOL_PATH}, no session, no database): ${fmt(toolRun)}; ${(toolRun.rps / bareRun.rps).toFixed(2)}x the bare handler`,
      );
    const la = (l: number[]) => l.map((x) => x.toFixed(2)).join(' ');
    console.log(`load average (1, 5, 15 min): ${la(loadBefore)} before, ${la(os.loadavg())} after (2-core machine: above 2 the figures are noisy)`);
    console.log(
      `ratio app/bare           : ${ratio.toFixed(2)}x  (goal >= 0.5x: ${ratio >= 0.5 ? 'met' : 'not met'}); app p95 ${appRun.p95.toFixed(1)} ms (goal < 100 ms: ${appRun.p95 < 100 ? 'met' : 'not met'})`,
    );
    // For `npm run bench` (bench/bench.ts): the same figures as JSON.
    writeBenchResults({
      bench: 'grading',
      loadAverage: { before: loadBefore, after: os.loadavg() },
      figures: [
        ratioFigure('graded quiz submissions, app, req/s', appRun.rps, 'req/s', { name: 'bare node:http doing one INSERT', value: bareRun.rps }, 0.5),
        {
          name: 'graded quiz submissions, app, p95',
          value: appRun.p95,
          unit: 'ms',
          anchor: { name: 'bare handler, p95', value: bareRun.p95, unit: 'ms' },
          goal: '< 100 ms',
          met: appRun.p95 < 100,
        },
        ...(appRun.cpuMsPerRequest === undefined
          ? []
          : [
              {
                name: 'graded quiz submission, server CPU per request',
                value: appRun.cpuMsPerRequest,
                unit: 'ms',
                ...(bareRun.cpuMsPerRequest === undefined ? {} : { anchor: { name: 'bare handler', value: bareRun.cpuMsPerRequest, unit: 'ms' } }),
              },
            ]),
      ],
      notes: [
        `app (one next start process): ${fmt(appRun)}`,
        `bare: ${fmt(bareRun)}`,
        ...(floorRun ? [`floor (GET /api/health): ${fmt(floorRun)}; ${(floorRun.rps / bareRun.rps).toFixed(2)}x the bare handler`] : []),
        ...(toolRun
          ? [`framework floor (GET ${TOOL_PATH}, no session, no database): ${fmt(toolRun)}; ${(toolRun.rps / bareRun.rps).toFixed(2)}x the bare handler`]
          : []),
      ],
    });
  } finally {
    app?.kill('SIGTERM');
    await new Promise<void>((r) => (bare ? bare.close(() => r()) : r()));
    await pool?.end();
  }
}

function poolConfig(connectionLimit: number): mariadb.PoolConfig {
  const url = new URL(dbUrl!);
  return {
    host: url.hostname,
    port: Number(url.port || 3306),
    user: decodeURIComponent(url.username),
    password: decodeURIComponent(url.password),
    database: url.pathname.slice(1),
    connectionLimit,
    timezone: '+00:00',
  };
}

main().catch((error) => {
  console.error('[bench] failed:', error);
  process.exitCode = 1;
});

// The bad-input sweep: generated bad requests (fast-check) to every method of every route handler
// under app/, each sent with a session that passes the route's role check so the input reaches
// validation. Asserts for every request: no 5xx (a throw counts as one), every 4xx answers JSON with
// a human message, a write route never accepts the bad input; and for every route: nothing written
// to the database (CHECKSUM TABLE of every table before and after). A route handler discovered from
// app/ that the table in tests/support/bad-input/routes.ts does not list fails the first test.
//
// Replay a failure with the seed it prints: BAD_INPUT_SEED=<seed> npm test -- tests/integration/bad-input.test.ts
// BAD_INPUT_RUNS (default 300 per handler) scales the number of requests.
import { createRequire } from 'node:module';
import fc from 'fast-check';
import { encode as encodeJwt } from 'next-auth/jwt';
import { NextRequest } from 'next/server';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { getEnv } from '@/lib/env';
import { db } from '@/models';
import type { SessionUser } from '@/lib/auth/users';
import { createCourses, createUser, resetDatabase } from '../support/db';
import { actAs } from '../support/session';
import { discoverRoutes } from '../support/app-routes';
import type { BadBody } from '../support/bad-input/arbitraries';
import { changedTables, fingerprint, tableNames } from '../support/bad-input/fingerprint';
import { EVERYONE, SWEEP, type SweepSpec, type Who } from '../support/bad-input/routes';
import { encode, nextAuthRequests, photoRequests, webhookRequests, type NextAuthContext, type RawRequest } from '../support/bad-input/special';
import { useTemporaryStorage } from '../support/practical-fixtures';

const SEED = process.env.BAD_INPUT_SEED ? Number(process.env.BAD_INPUT_SEED) : 20261202;
const RUNS = Number(process.env.BAD_INPUT_RUNS ?? 300);
const MIN_REQUESTS = 10_000;

/**
 * Tables a rejected request may legitimately write, per route, with the reason. Nothing else is
 * excluded from the fingerprint.
 */
const MAY_WRITE: Record<string, { table: string; why: string }[]> = {
  // Every public certificate check counts against the client's address (lib/throttle.ts, 60 per
  // 10 minutes), a malformed or unknown serial included: that is the throttle doing its job.
  'app/api/certificates/[serial]/route.ts#GET': [{ table: 'rate_limits', why: 'verification throttle counts every check per address' }],
  // A sign-in with a valid CSRF token is counted per e-mail and address, per address and per
  // account before the password is checked (lib/auth/sign-in-throttle.ts), across app servers.
  'app/api/auth/[...nextauth]/route.ts#POST': [{ table: 'rate_limits', why: 'sign-in attempts are counted for the sign-in throttle' }],
};

type Handler = (request: Request, context: { params: Promise<Record<string, string | string[]>> }) => Promise<Response>;
type Target = { key: string; file: string; pattern: string; method: string };

const targets: Target[] = discoverRoutes().flatMap((r) =>
  r.kind === 'route' ? r.methods.map((method) => ({ key: `${r.file}#${method}`, file: r.file, pattern: r.pattern, method })) : [],
);

let sent = 0;
const users: Partial<Record<Who, SessionUser>> = {};
let nextAuth: NextAuthContext;
let sign: (payload: string, options?: { timestamp?: number; secret?: string }) => string;
let storage: ReturnType<typeof useTemporaryStorage>;

// next-auth's route handler reads cookies() and headers() from next/headers, which only work inside
// Next's request scope. The sweep calls handlers directly, so they answer from the request being sent.
let current: Request | null = null;
const nextHeaders = createRequire(import.meta.url)('next/headers') as { headers: unknown; cookies: unknown };
const realHeaders = { headers: nextHeaders.headers, cookies: nextHeaders.cookies };

function parseCookies(header: string | null): { name: string; value: string }[] {
  if (!header) return [];
  return header.split(/;\s*/).flatMap((pair) => {
    const at = pair.indexOf('=');
    if (at <= 0) return [];
    let value = pair.slice(at + 1);
    try {
      value = decodeURIComponent(value);
    } catch {
      /* kept raw, as the cookie parser does */
    }
    return [{ name: pair.slice(0, at), value }];
  });
}

beforeAll(async () => {
  storage = useTemporaryStorage();
  nextHeaders.headers = async () => new Headers(current?.headers);
  nextHeaders.cookies = async () => ({
    getAll: () => parseCookies(current?.headers.get('cookie') ?? null),
    get: (n: string) => parseCookies(current?.headers.get('cookie') ?? null).find((c) => c.name === n),
  });

  await resetDatabase();
  const { flagship } = await createCourses();
  users.learner = await createUser('learner');
  users.instructor = await createUser('instructor');
  users.coordinator = await createUser('coordinator');
  users.admin = await createUser('admin');
  // The learner holds a place, so an upload reaches the photo checks instead of stopping at "not enrolled".
  await db().Enrollment.create({ userId: users.learner.id, courseId: flagship.id, workshopId: null, runKey: 'self-paced', status: 'active', feeCents: 4500 });
  // The program page was saved once, so a logo upload reaches the image checks instead of stopping at "save the name first".
  await db().ProgramSetting.create({
    id: 1,
    name: 'Sweep County preserving program',
    shortName: 'Sweep',
    contactEmail: null,
    contactPhone: null,
    postalAddress: null,
    timeZone: 'America/Denver',
    updatedById: null,
  });

  const secret = getEnv().NEXTAUTH_SECRET;
  const sessionCookies = await Promise.all(
    (['learner', 'instructor', 'coordinator', 'admin'] as const).map(async (role) => {
      const u = users[role]!;
      return `next-auth.session-token=${await encodeJwt({ token: { sub: String(u.id), uid: u.id, roles: [role], email: u.email, name: u.name }, secret })}`;
    }),
  );
  const { GET } = (await import('@/app/api/auth/[...nextauth]/route')) as unknown as { GET: Handler };
  const csrfRequest = new NextRequest('http://localhost:3000/api/auth/csrf');
  current = csrfRequest;
  const csrf = await GET(csrfRequest, { params: Promise.resolve({ nextauth: ['csrf'] }) });
  expect(csrf.status).toBe(200);
  const csrfCookie = csrf.headers
    .getSetCookie()
    .find((c) => c.startsWith('next-auth.csrf-token='))!
    .split(';')[0];
  nextAuth = { csrfToken: (await csrf.json()).csrfToken, csrfCookie, sessionCookies, knownEmail: users.learner.email };

  const stripe = new Stripe('sk_test_sweep', { telemetry: false });
  const webhookSecret = getEnv().STRIPE_WEBHOOK_SECRET;
  sign = (payload, options = {}) =>
    stripe.webhooks.generateTestHeaderString({ payload, secret: options.secret ?? webhookSecret, timestamp: options.timestamp });
  console.log(`[bad-input] seed ${SEED}, ${RUNS} runs per handler, ${targets.length} handlers (replay: BAD_INPUT_SEED=${SEED})`);
});

afterAll(() => {
  nextHeaders.headers = realHeaders.headers;
  nextHeaders.cookies = realHeaders.cookies;
  storage?.cleanup();
});

/** A generated request: who sends it, its path parameters, query, headers and body. */
type Generated = { who: Who; raw: RawRequest };

function requestsFor(target: Target, spec: SweepSpec): fc.Arbitrary<Generated> {
  const who = fc.oneof({ weight: 9, arbitrary: fc.constantFrom(...spec.who) }, { weight: 1, arbitrary: fc.constantFrom(...EVERYONE) });
  let raw: fc.Arbitrary<RawRequest>;
  if (spec.special === 'nextauth') raw = nextAuthRequests(nextAuth, target.method as 'GET' | 'POST');
  else if (spec.special === 'webhook') raw = webhookRequests(sign);
  else if (spec.special === 'photo-upload') raw = photoRequests();
  else if (spec.special === 'logo-upload') raw = photoRequests('logo');
  else {
    const params = fc.record(spec.params ?? {}) as fc.Arbitrary<Record<string, string>>;
    const body: fc.Arbitrary<BadBody | null> = target.method === 'GET' || !spec.body ? fc.constant(null) : spec.body;
    raw = fc
      .record({ params, query: spec.query ?? fc.constant<[string, string][]>([]), headers: spec.headers ?? fc.constant<Record<string, string>>({}), body })
      .map(({ params, query, headers, body }): RawRequest => ({
        params,
        query,
        headers,
        body: body?.body ?? null,
        contentType: body?.contentType ?? null,
        kind: body?.kind ?? 'query/params',
      }));
  }
  return fc.record({ who, raw });
}

function urlOf(pattern: string, params: Record<string, string | string[]>, query: [string, string][]): URL {
  const path = pattern.replace(/\[(?:\.\.\.)?(\w+)\]/g, (_, name: string) => {
    const value = params[name];
    return Array.isArray(value) ? value.map(encode).join('/') : encode(value ?? '');
  });
  const url = new URL(path, 'http://localhost:3000');
  for (const [k, v] of query) url.searchParams.append(k.toWellFormed(), v.toWellFormed());
  return url;
}

function describeRequest(target: Target, g: Generated): string {
  const body =
    g.raw.body instanceof FormData
      ? '[multipart form]'
      : typeof g.raw.body === 'string'
        ? JSON.stringify(g.raw.body.slice(0, 300))
        : g.raw.body
          ? `[${g.raw.body.length} bytes]`
          : 'none';
  return `${target.method} ${target.pattern} as ${g.who} (${g.raw.kind}) params=${JSON.stringify(g.raw.params ?? {}).slice(0, 200)} query=${JSON.stringify(g.raw.query).slice(0, 200)} type=${g.raw.contentType} headers=${JSON.stringify(g.raw.headers).slice(0, 200)} body=${body}`;
}

async function send(target: Target, handler: Handler, g: Generated): Promise<Response> {
  sent += 1;
  actAs(g.who === 'visitor' ? null : users[g.who]!);
  const headers = new Headers();
  for (const [k, v] of Object.entries(g.raw.headers)) headers.set(k, v);
  if (g.raw.contentType !== null) headers.set('content-type', g.raw.contentType);
  const hasBody = target.method !== 'GET' && g.raw.body !== null;
  const request = new NextRequest(urlOf(target.pattern, g.raw.params ?? {}, g.raw.query), {
    method: target.method,
    headers,
    body: hasBody ? (g.raw.body as BodyInit) : undefined,
  });
  current = request;
  try {
    return await handler(request, { params: Promise.resolve(g.raw.params ?? {}) });
  } catch (error) {
    // Next answers a handler that throws with a bare 500: count it as one.
    return new Response(`handler threw: ${(error as Error)?.stack ?? String(error)}`, { status: 500 });
  }
}

/** A 4xx must explain itself: JSON { error, message } with a sentence a person can read. */
async function unclearReason(response: Response): Promise<string | null> {
  const text = await response.text();
  if (!(response.headers.get('content-type') ?? '').includes('application/json'))
    return `not JSON (${response.headers.get('content-type')}): ${text.slice(0, 200)}`;
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    return `body is not valid JSON: ${text.slice(0, 200)}`;
  }
  const { error, message } = (body ?? {}) as { error?: unknown; message?: unknown };
  if (typeof error !== 'string' || !error) return `no "error" code: ${text.slice(0, 200)}`;
  if (typeof message !== 'string') return `no "message": ${text.slice(0, 200)}`;
  if (message.length < 10 || message.length > 1_000 || !/\p{L}{3,}\s+\p{L}{2,}/u.test(message))
    return `message is not a readable sentence: ${JSON.stringify(message.slice(0, 300))}`;
  if (/\n\s+at |SequelizeError|TypeError|undefined is not|Cannot read prop/.test(message)) return `message leaks internals: ${message.slice(0, 300)}`;
  return null;
}

describe('bad-input sweep', () => {
  it('lists every route handler method discovered under app/ (and nothing that is gone)', () => {
    const discovered = targets.map((t) => t.key).sort();
    expect(discovered.length).toBeGreaterThan(30);
    const missing = discovered.filter((k) => !(k in SWEEP));
    const stale = Object.keys(SWEEP).filter((k) => !discovered.includes(k));
    expect(missing, 'route handlers with no row in tests/support/bad-input/routes.ts').toEqual([]);
    expect(stale, 'rows in tests/support/bad-input/routes.ts for handlers that no longer exist').toEqual([]);
  });

  it('notices a write in any table, and excludes only tables that exist', async () => {
    const tables = await tableNames();
    for (const { table } of Object.values(MAY_WRITE).flat()) expect(tables).toContain(table);
    const before = await fingerprint();
    const row = await db().AuditLog.create({ actorId: null, action: 'sweep.self-check', subjectType: 'test', subjectId: '1', data: {} });
    expect(changedTables(before, await fingerprint())).toEqual([expect.stringMatching(/^audit_logs: /)]);
    await row.destroy();
    expect(changedTables(before, await fingerprint())).toEqual([]);
  });

  it('keeps the url of a failed sign-in (the sign-in form reads its error code) beside the message', async () => {
    const { POST } = (await import('@/app/api/auth/[...nextauth]/route')) as unknown as { POST: Handler };
    const body = `csrfToken=${encode(nextAuth.csrfToken)}&email=${encode(users.instructor!.email)}&password=wrong-password-1&callbackUrl=%2Fpantry&json=true`;
    const request = new NextRequest('http://localhost:3000/api/auth/callback/credentials', {
      method: 'POST',
      headers: { cookie: nextAuth.csrfCookie, 'content-type': 'application/x-www-form-urlencoded' },
      body,
    });
    current = request;
    const response = await POST(request, { params: Promise.resolve({ nextauth: ['callback', 'credentials'] }) });
    expect(response.status).toBe(401);
    const answer = await response.json();
    expect(new URL(answer.url).searchParams.get('error')).toBe('CredentialsSignin');
    expect(answer).toMatchObject({ error: 'unauthorized', message: 'That e-mail address and password do not match an account.' });
  });

  for (const target of targets) {
    const spec = SWEEP[target.key];
    if (!spec) continue; // failed by the coverage test above
    it(`${target.method} ${target.pattern}`, async () => {
      const mod = (await import(/* @vite-ignore */ `@/${target.file.replace(/\.ts$/, '')}`)) as Record<string, Handler>;
      const handler = mod[target.method];
      expect(typeof handler).toBe('function');
      const exclude = (MAY_WRITE[target.key] ?? []).map((e) => e.table);
      const before = await fingerprint(exclude);
      const beforeAll = await fingerprint();
      const statuses = new Map<number, number>();
      const messages = new Map<string, number>();
      const property = fc.asyncProperty(requestsFor(target, spec), async (g) => {
        const response = await send(target, handler, g);
        statuses.set(response.status, (statuses.get(response.status) ?? 0) + 1);
        const what = describeRequest(target, g);
        if (response.status >= 500) throw new Error(`${response.status} for ${what}\n${(await response.text()).slice(0, 1_500)}`);
        if (response.status < 400 && !spec.mayAnswerOk)
          throw new Error(`bad input accepted with ${response.status}: ${what}\n${(await response.text()).slice(0, 500)}`);
        if (process.env.BAD_INPUT_DEBUG && response.status >= 400)
          messages.set(
            `${response.status} ${(await response.clone().text()).slice(0, 120)}`,
            (messages.get(`${response.status} ${(await response.clone().text()).slice(0, 120)}`) ?? 0) + 1,
          );
        if (response.status >= 400) {
          const reason = await unclearReason(response);
          if (reason) throw new Error(`${response.status} without a clear message (${reason}) for ${what}`);
        } else await response.arrayBuffer();
      });
      try {
        await fc.assert(property, { seed: SEED, numRuns: RUNS, endOnFailure: true });
      } catch (error) {
        const cause = (error as { cause?: unknown }).cause;
        throw new Error(
          `[bad-input] ${target.method} ${target.pattern} failed; replay with BAD_INPUT_SEED=${SEED}\n${(error as Error).message}${cause instanceof Error ? `\nReason: ${cause.message}` : ''}`,
        );
      }
      const after = await fingerprint(exclude);
      expect(changedTables(before, after), `tables written by bad requests to ${target.method} ${target.pattern}`).toEqual([]);
      if (process.env.BAD_INPUT_DEBUG)
        console.log(
          [...messages]
            .sort((a, b) => b[1] - a[1])
            .slice(0, 12)
            .map(([m, n]) => `${n}× ${m}`)
            .join('\n'),
        );
      const allowed = changedTables(beforeAll, await fingerprint());
      console.log(
        `[bad-input] ${target.method} ${target.pattern}: ${JSON.stringify(Object.fromEntries([...statuses].sort((a, b) => a[0] - b[0])))}${allowed.length ? `; allowed writes: ${allowed.join(', ')}` : ''}`,
      );

      // The bad input must reach validation: most answers are not the role check's 401/403.
      const total = [...statuses.values()].reduce((a, b) => a + b, 0);
      const guarded = (statuses.get(401) ?? 0) + (statuses.get(403) ?? 0);
      expect(total).toBeGreaterThanOrEqual(RUNS);
      if (!spec.who.includes('visitor'))
        expect(guarded / total, `share of 401/403 for ${target.key}: ${JSON.stringify(Object.fromEntries(statuses))}`).toBeLessThan(0.5);
    }, 120_000);
  }

  it(`sent at least ${MIN_REQUESTS} bad requests in all`, () => {
    console.log(`[bad-input] ${sent} requests sent`);
    expect(sent).toBeGreaterThanOrEqual(MIN_REQUESTS);
  });
});

import { beforeAll, describe, expect, it } from 'vitest';
import { discoverRoutes } from '../support/app-routes';
import { createAuthorizationFixtures, FIXTURE_PASSWORD } from './support/authorization-fixtures';
import { MATRIX, rowKey, SUBJECTS, type Fixtures, type PageRow, type RouteRow, type Subject } from './support/authorization-matrix';
import { send, signInHttp, type Jar } from './support/http';
import { privateSentences, sendRouterRequest } from './support/router-request';
import { securityHeaderProblems } from './support/security-headers';

function discoveredKeys(): string[] {
  return discoverRoutes().flatMap((r) => {
    if (r.kind === 'page') return [`page ${r.pattern}`];
    if (r.kind === 'route') return r.methods.map((m) => `route ${m} ${r.pattern}`);
    return r.actions.map((a) => `action ${r.pattern} ${a}`);
  });
}

describe('the authorization matrix covers app/', () => {
  it('lists every discovered page, route method and server action, and nothing that is gone', () => {
    const discovered = new Set(discoveredKeys());
    const listed = new Set(MATRIX.map(rowKey));
    expect(discovered.size).toBeGreaterThan(50);
    expect(
      [...discovered].filter((k) => !listed.has(k)),
      'in app/ but not in tests/e2e/support/authorization-matrix.ts',
    ).toEqual([]);
    expect(
      [...listed].filter((k) => !discovered.has(k)),
      'in the matrix but no longer in app/',
    ).toEqual([]);
  });

  it('gives every row an answer for each of the seven people, and requests at least one column', () => {
    for (const row of MATRIX) {
      expect(Object.keys(row.expect).sort(), rowKey(row)).toEqual([...SUBJECTS].sort());
      expect(
        Object.values(row.expect).some((e) => e !== 'n/a'),
        rowKey(row),
      ).toBe(true);
    }
  });
});

describe('the authorization matrix against the running app', () => {
  let fixtures: Fixtures;
  const jars = {} as Record<Subject, Jar | undefined>;
  let learnerB: Jar;

  beforeAll(async () => {
    const people = await createAuthorizationFixtures();
    fixtures = people.fixtures;
    jars.visitor = undefined;
    jars.own = (await signInHttp(people.emails.a, FIXTURE_PASSWORD)).jar;
    jars.other = jars.own; // A again: the probes point this column at B's records
    learnerB = (await signInHttp(people.emails.b, FIXTURE_PASSWORD)).jar;
    jars.instructor = (await signInHttp(people.emails.instructor, FIXTURE_PASSWORD)).jar;
    jars.coordinator = (await signInHttp('coordinator@cedarhollow.example', 'demo-coordinator-pass')).jar;
    jars.admin = (await signInHttp('admin@cedarhollow.example', 'demo-admin-pass')).jar;
    jars.volunteer = (await signInHttp('instructor@cedarhollow.example', 'demo-instructor-pass')).jar;
  });

  type Outcome = { key: string; subject: Subject; path: string; expected: string; got: string };

  async function walk(row: PageRow | RouteRow): Promise<{ outcomes: Outcome[]; headerProblems: string[] }> {
    const outcomes: Outcome[] = [];
    const headerProblems: string[] = [];
    for (const [i, subject] of SUBJECTS.entries()) {
      const expected = row.expect[subject];
      if (expected === 'n/a') continue;
      const request = row.probe(fixtures, subject);
      const method = row.kind === 'route' ? row.method : 'GET';
      // Each person from an address of their own, so throttles keyed by address stay apart.
      const headers = { 'x-forwarded-for': `198.51.100.${i + 10}`, ...(request.headers ?? {}) };
      const response = await send(request.path, { method, body: request.body, headers, jar: jars[subject] });
      let got = String(response.status);
      if (expected === 'signin') {
        const location = response.headers.get('location') ?? '';
        const target = new URL(location, 'http://x');
        got =
          [302, 303, 307, 308].includes(response.status) && target.pathname === '/signin' && target.searchParams.get('callbackUrl')
            ? 'signin'
            : `${response.status} ${location}`;
      }
      const body = await response.text();
      const wanted = row.kind === 'page' ? row.bodyIncludes?.[subject] : undefined;
      if (wanted && got === String(expected) && !body.includes(wanted)) got = `${got} without “${wanted}”`;
      outcomes.push({ key: rowKey(row), subject, path: request.path, expected: String(expected), got });
      headerProblems.push(...securityHeaderProblems(response).map((p) => `${method} ${request.path} as ${subject}: ${p}`));
    }
    return { outcomes, headerProblems };
  }

  it('answers every page and route as the table says, for each person, with the security headers', async () => {
    const outcomes: Outcome[] = [];
    const headerProblems: string[] = [];
    for (const row of MATRIX) {
      if (row.kind === 'action') continue; // called with each role in tests/integration/server-actions-authz.test.ts
      const result = await walk(row);
      outcomes.push(...result.outcomes);
      headerProblems.push(...result.headerProblems);
    }
    const wrong = outcomes.filter((o) => o.got !== o.expected).map((o) => `${o.key} as ${o.subject} (${o.path}): expected ${o.expected}, got ${o.got}`);
    expect(wrong).toEqual([]);
    expect(headerProblems).toEqual([]);
    // The walk really asked: one request per requested cell.
    const cells = MATRIX.filter((r) => r.kind !== 'action').reduce((n, r) => n + Object.values(r.expect).filter((e) => e !== 'n/a').length, 0);
    expect(outcomes).toHaveLength(cells);
  }, 240_000);

  // A page's content as someone allowed to see it (for the refused cells: what must not leak).
  const allowedPages = new Map<string, string | null>();
  async function allowedHtml(path: string): Promise<string | null> {
    if (!allowedPages.has(path)) {
      let html: string | null = null;
      for (const jar of [jars.own, learnerB, jars.instructor, jars.coordinator, jars.admin, jars.volunteer]) {
        const response = await send(path, { jar, headers: { 'x-forwarded-for': '198.51.100.40' } });
        const text = await response.text();
        if (response.status === 200) {
          html = text;
          break;
        }
      }
      allowedPages.set(path, html);
    }
    return allowedPages.get(path) ?? null;
  }

  it('refuses router requests that claim every layout is already on screen as it refuses plain loads, and neither carries the page', async () => {
    // What anyone may read (every page a visitor opens): a sentence found there is not private.
    let publicText = '';
    for (const row of MATRIX) {
      if (row.kind === 'page' && row.expect.visitor === 200) publicText += await (await send(row.probe(fixtures, 'visitor').path)).text();
    }
    // Every course's page (the matrix probes one), with its lessons' titles and summaries.
    for (const course of new Set(publicText.match(/\/courses\/[a-z0-9-]+(?=")/g))) publicText += await (await send(course)).text();
    const wrong: string[] = [];
    let refusedCompared = 0;
    for (const row of MATRIX) {
      if (row.kind !== 'page') continue;
      for (const [i, subject] of SUBJECTS.entries()) {
        const expected = row.expect[subject];
        if (expected === 'n/a') continue;
        const request = row.probe(fixtures, subject);
        const headers = { 'x-forwarded-for': `198.51.100.${i + 10}` };
        const where = `${row.pattern} as ${subject} (${request.path})`;
        const router = await sendRouterRequest(row.renders ?? row.pattern, request.path, { jar: jars[subject], headers });
        const routerBody = await router.text();
        if (expected === 200) {
          if (router.status !== 200) wrong.push(`${where}: the plain load is 200, the router request ${router.status}`);
          continue;
        }
        // Refused: the answer may be the router's redirect, the sign-in or the 403 page, never the page's content.
        const content = await allowedHtml(request.path);
        if (!content) continue; // no one of the matrix may open this address: nothing of it to leak
        const sentences = privateSentences(content, publicText);
        if (sentences.length === 0) {
          wrong.push(`${where}: no sentence of the allowed page to compare with (the check would prove nothing)`);
          continue;
        }
        refusedCompared += 1;
        const plain = await send(request.path, { jar: jars[subject], headers });
        for (const [kind, status, body] of [
          ['plain load', plain.status, await plain.text()],
          ['router request', router.status, routerBody],
        ] as const) {
          const leaked = sentences.filter((sentence) => body.includes(sentence));
          if (leaked.length)
            wrong.push(`${where}: the ${kind} (${status}) carries ${leaked.length} of ${sentences.length} sentences of the page, e.g. “${leaked[0]}”`);
        }
      }
    }
    expect(wrong).toEqual([]);
    // The walk compared refused cells for real (each page row that refuses someone, with something to hide).
    expect(refusedCompared).toBeGreaterThan(20);
  }, 240_000);
});

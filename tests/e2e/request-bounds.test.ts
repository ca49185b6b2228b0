// The running production server refuses what a page of another site or an oversized body would make
// it do: bodies over 64 KB are a 413 before they are read (the server's memory does not grow by
// them), writes from another site's page are a 403, JSON is read only as application/json, and the
// address after sign-in stays on the site.
import fs from 'node:fs';
import { describe, expect, it } from 'vitest';
import { baseUrl, openBrowser } from './support/browser';
import { send, signInHttp } from './support/http';

const TEN_MB = 10 * 1024 * 1024;

/** Resident memory of the app server and every process under it, in bytes (Linux /proc). */
function serverRss(): number {
  const pids = [Number(process.env.E2E_SERVER_PID)];
  let total = 0;
  while (pids.length) {
    const pid = pids.pop()!;
    try {
      const status = fs.readFileSync(`/proc/${pid}/status`, 'utf8');
      total += Number(/VmRSS:\s+(\d+) kB/.exec(status)?.[1] ?? 0) * 1024;
      for (const task of fs.readdirSync(`/proc/${pid}/task`)) {
        const children = fs.readFileSync(`/proc/${pid}/task/${task}/children`, 'utf8').trim();
        if (children) pids.push(...children.split(/\s+/).map(Number));
      }
    } catch (error) {
      // A short-lived child that ended between the listing and the read holds no memory any more.
      if ((error as NodeJS.ErrnoException).code !== 'ENOENT' || pid === Number(process.env.E2E_SERVER_PID)) throw error;
    }
  }
  return total;
}

/** A 10 MB body in 256 KB chunks with no Content-Length (chunked transfer). */
function chunkedTenMegabytes(fill: string): ReadableStream<Uint8Array> {
  const chunk = new TextEncoder().encode(fill.repeat(256 * 1024).slice(0, 256 * 1024));
  let sent = 0;
  return new ReadableStream({
    pull(controller) {
      if (sent >= TEN_MB) return controller.close();
      sent += chunk.byteLength;
      controller.enqueue(chunk);
    },
  });
}

async function post(path: string, body: BodyInit, headers: Record<string, string>): Promise<Response> {
  return fetch(new URL(path, baseUrl()), { method: 'POST', body, headers, redirect: 'manual', duplex: 'half' } as RequestInit);
}

describe('bounded bodies', () => {
  it('answers a 10 MB body on /api/register and on the sign-in callback with 413, and the server does not hold it', async () => {
    const targets = [
      { path: '/api/register', type: 'application/json', fill: '{"name":"' + 'x'.repeat(64) },
      { path: '/api/auth/callback/credentials', type: 'application/x-www-form-urlencoded', fill: 'email=a%40b.example&password=' + 'y'.repeat(64) },
    ];
    async function round(n: number) {
      for (const [i, target] of targets.entries()) {
        const headers = { 'content-type': target.type, 'x-forwarded-for': `203.0.113.${20 * i + n + 1}` };
        // Declared up front (refused before a byte is read) and streamed without a length (refused after 64 KB).
        const declared = await post(target.path, new Uint8Array(TEN_MB).fill(0x61), headers);
        const streamed = await post(target.path, chunkedTenMegabytes(target.fill), headers);
        for (const response of [declared, streamed]) {
          expect(response.status, target.path).toBe(413);
          expect(await response.json()).toMatchObject({ error: 'too_large', message: expect.stringMatching(/larger than 64 KB/) });
        }
      }
    }
    // The server's allocator settles at its own high-water mark for socket buffers first (about
    // 50 MB over three rounds here; six, as another browser file may be loading the machine: after
    // three it once grew 20.8 MB more); after that, more bodies must not add to it. RSS moves by a few
    // MB on its own (10.5 MB once in CI-like runs), so 240 MB are sent and the bound is two bodies:
    // a server that held each body, even for a moment, would grow by far more.
    for (let n = 0; n < 6; n++) await round(n);
    const before = serverRss();
    for (let n = 6; n < 12; n++) await round(n);
    const grown = serverRss() - before;
    expect(grown, `the server grew by ${(grown / 1024 / 1024).toFixed(1)} MB`).toBeLessThan(2 * TEN_MB);
    // And it still answers as usual.
    expect((await send('/api/health')).status).toBe(200);
  }, 120_000);
});

describe('requests from other sites', () => {
  it('refuses a write sent with another site’s Origin or Sec-Fetch-Site with 403, and lets the app’s own and header-less ones through', async () => {
    const { jar } = await signInHttp('learner@cedarhollow.example', 'demo-learner-pass');
    const own = new URL(baseUrl()).origin;
    const cases: [Record<string, string>, number][] = [
      [{ origin: 'https://evil.example' }, 403],
      [{ 'sec-fetch-site': 'cross-site', origin: 'https://evil.example' }, 403],
      [{ 'sec-fetch-site': 'same-site' }, 403],
      [{ origin: 'null' }, 403],
      // Let through the guard and the origin check, then refused on its merits (an empty enrollment).
      [{ origin: own }, 400],
      [{ 'sec-fetch-site': 'same-origin', origin: own }, 400],
      [{}, 400],
    ];
    for (const [headers, status] of cases) {
      const response = await send('/api/enrollments', { method: 'POST', jar, body: {}, headers });
      expect(response.status, JSON.stringify(headers)).toBe(status);
      const answer = await response.json();
      if (status === 403) expect(answer).toMatchObject({ error: 'forbidden', message: expect.stringMatching(/another website/) });
    }
    // The sign-in callback (it sets a session cookie) too.
    const csrf = await send('/api/auth/csrf');
    const { csrfToken } = (await csrf.json()) as { csrfToken: string };
    const form = new URLSearchParams({ csrfToken, email: 'learner@cedarhollow.example', password: 'demo-learner-pass', json: 'true' }).toString();
    const crossSite = await send('/api/auth/callback/credentials', {
      method: 'POST',
      body: form,
      headers: { 'content-type': 'application/x-www-form-urlencoded', origin: 'https://evil.example', 'x-forwarded-for': '203.0.113.50' },
    });
    expect(crossSite.status).toBe(403);
    expect(crossSite.headers.getSetCookie().some((c) => c.includes('session-token'))).toBe(false);
    // A read is never refused for its origin.
    expect((await send('/api/pantry', { jar, headers: { origin: 'https://evil.example', 'sec-fetch-site': 'cross-site' } })).status).toBe(200);
  });

  it('reads a JSON body only as application/json (415 for text/plain, which needs no preflight)', async () => {
    const { jar } = await signInHttp('learner@cedarhollow.example', 'demo-learner-pass');
    for (const type of ['text/plain', 'text/plain; application/json', 'application/x-www-form-urlencoded']) {
      const response = await send('/api/progress', {
        method: 'POST',
        jar,
        body: JSON.stringify({ courseSlug: 'pickling-and-canning', lessonSlug: 'no-such-lesson' }),
        headers: { 'content-type': type },
      });
      expect(response.status, type).toBe(415);
      expect(await response.json()).toMatchObject({ error: 'unsupported_media' });
    }
    // With a charset the body is read and reaches validation (a lesson that does not exist; no demo data changes).
    const json = await send('/api/progress', {
      method: 'POST',
      jar,
      body: { courseSlug: 'pickling-and-canning', lessonSlug: 'no-such-lesson' },
      headers: { 'content-type': 'application/json; charset=utf-8' },
    });
    expect([400, 404]).toContain(json.status);
    expect(await json.json()).not.toMatchObject({ error: 'unsupported_media' });
  });
});

describe('the address after sign-in', () => {
  it.each([['/%5Cevil.example/x'], ['/%09/evil.example']])('stays on the site when signing in from /signin?callbackUrl=%s', async (callback) => {
    const { page, close } = await openBrowser();
    try {
      const offSite: string[] = [];
      page.on('request', (request) => {
        if (!request.url().startsWith(baseUrl())) offSite.push(request.url());
      });
      await page.goto(`/signin?callbackUrl=${callback}`);
      await page.getByLabel('E-mail').fill('learner@cedarhollow.example');
      await page.getByLabel('Password').fill('demo-learner-pass');
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.getByTestId('signed-in-as').waitFor();
      await page.waitForLoadState('load');
      expect(new URL(page.url()).origin).toBe(new URL(baseUrl()).origin);
      expect(offSite).toEqual([]);
    } finally {
      await close();
    }
  });
});

// The production server's static pages from memory (server.ts, lib/server/static-pages.ts) answer
// exactly what Next answers: same status, same headers (but the per-response ones), same bytes;
// every request that is not a plain page load of a prerendered page still reaches Next.
import http from 'node:http';
import zlib from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { HIT_HEADER, RECORD_HEADER } from '../../lib/server/static-pages';
import { baseUrl } from './support/browser';
import { send, signInHttp } from './support/http';

type Raw = { status: number; headers: [string, string][]; body: Buffer };

/** One request with exactly these headers (fetch would add Accept-Encoding and decompress). */
function raw(path: string, headers: Record<string, string> = {}, method = 'GET'): Promise<Raw> {
  const url = new URL(path, baseUrl());
  return new Promise((resolve, reject) => {
    const req = http.request({ host: url.hostname, port: url.port, path: url.pathname + url.search, method, headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => {
        const pairs: [string, string][] = [];
        for (let i = 0; i < res.rawHeaders.length; i += 2) pairs.push([res.rawHeaders[i].toLowerCase(), res.rawHeaders[i + 1]]);
        resolve({ status: res.statusCode!, headers: pairs, body: Buffer.concat(chunks) });
      });
    });
    req.on('error', reject);
    req.end();
  });
}

const header = (r: Raw, name: string) => r.headers.find(([n]) => n === name)?.[1];
const PER_RESPONSE = new Set(['date', 'connection', 'keep-alive', 'transfer-encoding', 'content-length', HIT_HEADER]);
const comparable = (r: Raw) => r.headers.filter(([n]) => !PER_RESPONSE.has(n));

/** Asks until the server answers from memory (the first plain request of a variant starts its recording). */
async function untilHit(path: string, headers: Record<string, string> = {}): Promise<Raw> {
  for (let i = 0; i < 50; i++) {
    const r = await raw(path, headers);
    if (header(r, HIT_HEADER) === 'hit') return r;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`${path} was never answered from memory`);
}

const PAGES = ['/bench', '/learn/pickling-and-canning/acidity', '/courses', '/'];

describe('static pages from memory', () => {
  it.each(PAGES)('%s: the same status, headers and bytes as Next, uncompressed and gzip', async (path) => {
    const encodings: Record<string, string>[] = [{}, { 'accept-encoding': 'gzip, deflate, br, zstd' }];
    for (const encoding of encodings) {
      const fromNext = await raw(path, { ...encoding, [RECORD_HEADER]: '1' });
      expect(fromNext.status).toBe(200);
      expect(header(fromNext, HIT_HEADER)).toBeUndefined();
      const fromMemory = await untilHit(path, encoding);
      expect(fromMemory.status).toBe(200);
      expect(comparable(fromMemory)).toEqual(comparable(fromNext));
      expect(fromMemory.body.equals(fromNext.body)).toBe(true);
      expect(Number(header(fromMemory, 'content-length'))).toBe(fromMemory.body.length);
      expect(header(fromMemory, 'date')).toMatch(/GMT$/);
    }
  });

  it('the gzip variant is the page, compressed once; security headers are on both', async () => {
    const plain = await untilHit('/bench');
    const gzip = await untilHit('/bench', { 'accept-encoding': 'gzip' });
    expect(header(gzip, 'content-encoding')).toBe('gzip');
    expect(zlib.gunzipSync(gzip.body).equals(plain.body)).toBe(true);
    for (const r of [plain, gzip]) {
      expect(header(r, 'content-security-policy')).toContain("default-src 'self'");
      expect(header(r, 'x-frame-options')).toBe('DENY');
    }
  });

  it('behind a TLS proxy (X-Forwarded-Proto: https) the kept answer carries HSTS, as Next’s does', async () => {
    const https = await untilHit('/bench', { 'x-forwarded-proto': 'https' });
    expect(header(https, 'strict-transport-security')).toMatch(/max-age=\d+/);
    expect(header(await untilHit('/bench'), 'strict-transport-security')).toBeUndefined();
  });

  it('HEAD gets the headers only; a known ETag gets 304', async () => {
    const page = await untilHit('/bench');
    const head = await raw('/bench', {}, 'HEAD');
    expect(head.status).toBe(200);
    expect(head.body.length).toBe(0);
    expect(header(head, 'content-length')).toBe(String(page.body.length));
    const again = await raw('/bench', { 'if-none-match': header(page, 'etag')! });
    expect(again.status).toBe(304);
    expect(again.body.length).toBe(0);
  });

  it('router requests, queries, other pages and signed-in pages that are not static all reach Next', async () => {
    await untilHit('/bench');
    const rsc = await raw('/bench', { rsc: '1' });
    expect(header(rsc, HIT_HEADER)).toBeUndefined();
    // Next's own answer to a router request (16.4: a 307 that adds the _rsc cache-buster), not the page.
    expect(rsc.status).not.toBe(200);
    expect(header(rsc, 'content-type') ?? '').not.toContain('text/html');
    expect(header(await raw('/bench?from=lesson'), HIT_HEADER)).toBeUndefined();
    expect(header(await raw('/api/health'), HIT_HEADER)).toBeUndefined();
    // A members-only lesson is rendered per request behind the enrollment check.
    const { jar } = await signInHttp('learner@cedarhollow.example', 'demo-learner-pass');
    const members = await send('/learn/pickling-and-canning/processing', { jar });
    expect(members.status).toBe(200);
    expect(members.headers.get(HIT_HEADER)).toBeNull();
    expect(members.headers.get('cache-control')).toMatch(/private|no-store|no-cache/);
  });
});

import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { HIT_HEADER, RECORD_HEADER, StaticPageCache, acceptedEncoding, notModified, recordable, recordingHeaders, sendRecorded, staticPagePaths, variantFor, type RecordedPage } from './static-pages';

// The shape of `next build`'s prerender-manifest.json entries (as written by Next 16.4 here).
const bypass = [{ type: 'header', key: 'next-action' }];
const manifest = {
  routes: {
    '/': { routeType: 'page', response: 'complete', initialRevalidateSeconds: false as const, experimentalBypassFor: bypass },
    '/bench': { routeType: 'page', response: 'complete', initialRevalidateSeconds: false as const },
    '/news': { routeType: 'page', response: 'complete', initialRevalidateSeconds: 60 },
    '/_not-found': { routeType: 'page', response: 'complete', initialStatus: 404, initialRevalidateSeconds: false as const },
    '/_global-error': { routeType: 'page', response: 'complete', initialRevalidateSeconds: false as const },
    '/icon.svg': { routeType: 'route', response: 'complete', initialRevalidateSeconds: false as const },
    '/gone': { routeType: 'page', response: 'complete', initialStatus: 410, initialRevalidateSeconds: false as const },
  },
};

describe('which pages and which requests', () => {
  const pages = new Set(staticPagePaths(manifest));

  it('keeps only pages built once: no revalidation, answered 200, not the error pages or route handlers', () => {
    expect([...pages]).toEqual(['/', '/bench']);
    expect(staticPagePaths({})).toEqual([]);
  });

  it('a plain page load of a static page has a variant per encoding (gzip or none) and per https', () => {
    expect(variantFor('GET', '/bench', {}, pages)).toEqual({ path: '/bench', variant: 'http ' });
    expect(variantFor('HEAD', '/bench', { 'accept-encoding': 'gzip, deflate, br' }, pages)).toEqual({ path: '/bench', variant: 'http gzip' });
    expect(variantFor('GET', '/bench', { 'accept-encoding': ' GZIP ', 'x-forwarded-proto': 'https' }, pages)?.variant).toBe('https gzip');
    // Whatever a client writes, a page has at most these four variants.
    expect(variantFor('GET', '/bench', { 'accept-encoding': 'br;q=1, zstd, foo, gzip;q=0.2' }, pages)?.variant).toBe('http gzip');
    expect(variantFor('GET', '/bench', { 'accept-encoding': 'br' }, pages)?.variant).toBe('http ');
    expect(variantFor('GET', '/bench', { 'accept-encoding': 'gzip;q=0, identity;q=0' }, pages)).toBeNull();
    // A session cookie does not change a prerendered page: Next answers it the same way.
    expect(variantFor('GET', '/bench', { cookie: 'next-auth.session-token=abc' }, pages)?.variant).toBe('http ');
  });

  it('everything that changes what Next answers goes to Next', () => {
    expect(variantFor('POST', '/bench', {}, pages)).toBeNull();
    expect(variantFor('GET', '/bench?x=1', {}, pages)).toBeNull();
    expect(variantFor('GET', '/bench/', {}, pages)).toBeNull();
    expect(variantFor('GET', '/news', {}, pages)).toBeNull();
    expect(variantFor('GET', undefined, {}, pages)).toBeNull();
    for (const name of ['rsc', 'next-router-prefetch', 'next-router-state-tree', 'next-router-segment-prefetch', 'next-action', 'next-url', 'x-nextjs-data', 'x-prerender-revalidate', 'x-middleware-prefetch', RECORD_HEADER]) {
      expect(variantFor('GET', '/bench', { [name]: '1' }, pages), name).toBeNull();
    }
    expect(variantFor('GET', '/bench', { cookie: 'a=1; __prerender_bypass=xyz' }, pages)).toBeNull();
  });

  it('Accept-Encoding as RFC 9110 §12.5.3 reads it, choosing between gzip and no coding', () => {
    expect(acceptedEncoding(undefined)).toBe('');
    expect(acceptedEncoding('  ')).toBe('');
    expect(acceptedEncoding('gzip, deflate, br, zstd')).toBe('gzip'); // what browsers send
    expect(acceptedEncoding('GZip;Q=0.5')).toBe('gzip');
    expect(acceptedEncoding('x-gzip')).toBe('gzip');
    expect(acceptedEncoding('*')).toBe('gzip');
    expect(acceptedEncoding('deflate')).toBe(''); // gzip not accepted: uncompressed, always acceptable
    expect(acceptedEncoding('gzip;q=0')).toBe('');
    expect(acceptedEncoding('gzip;q=0.1, identity;q=1')).toBe(''); // the client prefers no coding
    expect(acceptedEncoding('*;q=0')).toBeNull(); // neither: Next answers
    expect(acceptedEncoding('identity;q=0')).toBeNull();
    expect(acceptedEncoding('identity;q=0, *;q=0.3')).toBe('gzip');
    expect(acceptedEncoding('gzip;q=abc')).toBe('');
  });

  it('a recording asks Next with the variant’s own headers and marks itself', () => {
    expect(recordingHeaders('http ')).toEqual({ [RECORD_HEADER]: '1' });
    expect(recordingHeaders('https gzip')).toEqual({ [RECORD_HEADER]: '1', 'x-forwarded-proto': 'https', 'accept-encoding': 'gzip' });
  });
});

describe('what is kept', () => {
  const next = ['Content-Type', 'text/html; charset=utf-8', 'x-nextjs-prerender', '1', 'x-nextjs-prerender', '1', 'ETag', '"abc"', 'Date', 'Wed, 02 Dec 2026 05:39:29 GMT', 'Connection', 'keep-alive', 'Keep-Alive', 'timeout=5', 'Transfer-Encoding', 'chunked', 'Content-Length', '3'];

  it('keeps Next’s headers in order with repeats, drops the per-connection ones, adds the length', () => {
    const page = recordable(200, next, Buffer.from('abc'))!;
    expect(page.headers).toEqual(['Content-Type', 'text/html; charset=utf-8', 'x-nextjs-prerender', '1', 'x-nextjs-prerender', '1', 'ETag', '"abc"', HIT_HEADER, 'hit']);
    expect(page.headersWithLength.slice(-2)).toEqual(['Content-Length', '3']);
    expect(page.etag).toBe('"abc"');
  });

  it('never keeps an error, a cookie, a private answer or one that is not a prerendered page', () => {
    expect(recordable(500, next, Buffer.from('x'))).toBeNull();
    expect(recordable(304, next, Buffer.alloc(0))).toBeNull();
    expect(recordable(200, [...next, 'Set-Cookie', 'a=1'], Buffer.from('x'))).toBeNull();
    expect(recordable(200, [...next, 'Cache-Control', 'private, no-cache, no-store, max-age=0, must-revalidate'], Buffer.from('x'))).toBeNull();
    expect(recordable(200, ['Content-Type', 'text/html'], Buffer.from('x'))).toBeNull();
  });

  it('If-None-Match as RFC 9110 §13.1.2 reads it: a list, weak tags, or *', () => {
    expect(notModified('"abc"', '"abc"')).toBe(true);
    expect(notModified('"x", W/"abc"', '"abc"')).toBe(true);
    expect(notModified('*', '"abc"')).toBe(true);
    expect(notModified('"abd"', '"abc"')).toBe(false);
    expect(notModified(undefined, '"abc"')).toBe(false);
    expect(notModified('"abc"', undefined)).toBe(false);
  });

  it('records each variant once at a time, and again after a failed recording', () => {
    const cache = new StaticPageCache(['/bench']);
    const page = recordable(200, next, Buffer.from('abc'))!;
    expect(cache.shouldRecord('/bench', 'http ')).toBe(true);
    expect(cache.shouldRecord('/bench', 'http ')).toBe(false); // one recording at a time
    cache.finish('/bench', 'http ', null); // failed: a later miss tries again
    expect(cache.shouldRecord('/bench', 'http ')).toBe(true);
    cache.finish('/bench', 'http ', page);
    expect(cache.get('/bench', 'http ')).toBe(page);
    expect(cache.shouldRecord('/bench', 'http gzip')).toBe(true);
    cache.finish('/bench', 'http gzip', page);
    expect(cache.get('/bench', 'http gzip')).toBe(page);
    expect(cache.get('/bench', 'https gzip')).toBeUndefined();
    expect(cache.size).toBe(2);
  });
});

describe('sendRecorded over node:http', () => {
  const page: RecordedPage = recordable(200, ['Content-Type', 'text/html; charset=utf-8', 'x-nextjs-prerender', '1', 'ETag', '"e1"'], Buffer.from('<p>jars</p>'))!;
  let server: http.Server;
  let port: number;
  beforeAll(async () => {
    server = http.createServer((req, res) => sendRecorded(req, res, page));
    await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
    port = (server.address() as AddressInfo).port;
  });
  afterAll(() => new Promise<void>((r) => server.close(() => r())));

  const get = (method: string, headers: Record<string, string> = {}) =>
    new Promise<{ status: number; headers: http.IncomingHttpHeaders; body: string }>((resolve, reject) => {
      const req = http.request({ host: '127.0.0.1', port, method, path: '/', headers }, (res) => {
        let body = '';
        res.on('data', (c) => (body += c));
        res.on('end', () => resolve({ status: res.statusCode!, headers: res.headers, body }));
      });
      req.on('error', reject);
      req.end();
    });

  it('a GET gets the bytes with their length, a Date of its own and the hit marker', async () => {
    const res = await get('GET');
    expect(res.status).toBe(200);
    expect(res.body).toBe('<p>jars</p>');
    expect(res.headers['content-length']).toBe('11');
    expect(res.headers['content-type']).toBe('text/html; charset=utf-8');
    expect(res.headers.date).toMatch(/GMT$/);
    expect(res.headers[HIT_HEADER]).toBe('hit');
  });

  it('a HEAD gets the headers only; a matching If-None-Match gets a 304 without a body', async () => {
    const head = await get('HEAD');
    expect(head.status).toBe(200);
    expect(head.body).toBe('');
    expect(head.headers['content-length']).toBe('11');
    const cached = await get('GET', { 'if-none-match': '"e1"' });
    expect(cached.status).toBe(304);
    expect(cached.body).toBe('');
    expect(cached.headers.etag).toBe('"e1"');
    expect((await get('GET', { 'if-none-match': '"e0"' })).status).toBe(200);
  });
});

// The production server's answer for fully static pages (the pages `next build` prerendered once,
// with no revalidation): the same status, headers and bytes Next gave for the same kind of request,
// recorded from Next itself and then served from memory. Next answers a prerendered page from its
// own cache too, but walks its whole router for every request (about 1 ms of CPU each here) and
// gzips the page again for every browser; this answers in a few hundredths of that.
//
// Only plain page loads take this path: GET or HEAD, no query string, no router (RSC) or server
// action header, no draft-mode cookie. At most four variants of a page are kept: gzip or not (what
// the client accepts, read from Accept-Encoding as RFC 9110 §12.5.3 says; Next's own answer to
// `Accept-Encoding: gzip` or to none is recorded), each with or without X-Forwarded-Proto https
// (which adds HSTS). Anything else, and every request before its variant is recorded, goes to Next
// unchanged.
//
// Pure decisions (which pages, which requests, the 304) are functions here with unit tests;
// server.ts wires them to node:http.
import type { IncomingHttpHeaders, IncomingMessage, ServerResponse } from 'node:http';

/** The header the server sends its recording requests with: they always go to Next. */
export const RECORD_HEADER = 'x-brinewright-record';
/** Marks an answer from memory (like a proxy's X-Cache), for tests and for someone reading headers. */
export const HIT_HEADER = 'x-brinewright-cache';

/** A page entry of `<distDir>/prerender-manifest.json` (the fields read here). */
type ManifestRoute = {
  routeType?: string;
  initialRevalidateSeconds?: number | false;
  initialStatus?: number;
  response?: string;
};
export type PrerenderManifest = { routes?: Record<string, ManifestRoute> };

/**
 * The paths of the pages built once and never revalidated: page routes, complete, answered 200.
 * The not-found and global-error pages are prerendered too but are not addresses of their own.
 */
export function staticPagePaths(manifest: PrerenderManifest): string[] {
  return Object.entries(manifest.routes ?? {})
    .filter(([route, r]) => {
      if (r.routeType !== 'page' || r.initialRevalidateSeconds !== false) return false;
      if (r.initialStatus !== undefined && r.initialStatus !== 200) return false;
      if (r.response !== undefined && r.response !== 'complete') return false;
      return !route.startsWith('/_');
    })
    .map(([route]) => route)
    .sort();
}

/**
 * Which recorded variant answers this request, or null when Next must answer it: not a static
 * page, not a plain GET/HEAD page load, or carrying anything that changes Next's answer.
 */
export function variantFor(method: string | undefined, url: string | undefined, headers: IncomingHttpHeaders, pages: ReadonlySet<string>): { path: string; variant: string } | null {
  if (method !== 'GET' && method !== 'HEAD') return null;
  if (!url || url.includes('?') || !pages.has(url)) return null;
  for (const name of Object.keys(headers)) {
    // rsc and next-router-* (client navigation), next-action (server actions), x-next*,
    // x-prerender-revalidate and x-middleware-* (Next's internal requests), our own recordings.
    if (name === 'rsc' || name.startsWith('next-') || name.startsWith('x-next') || name.startsWith('x-prerender') || name.startsWith('x-middleware') || name === RECORD_HEADER) return null;
  }
  if (typeof headers.cookie === 'string' && headers.cookie.includes('__prerender_bypass')) return null;
  const encoding = acceptedEncoding(typeof headers['accept-encoding'] === 'string' ? headers['accept-encoding'] : undefined);
  if (encoding === null) return null;
  const https = headers['x-forwarded-proto'] === 'https';
  return { path: url, variant: `${https ? 'https' : 'http'} ${encoding}` };
}

/**
 * 'gzip' when the client accepts gzip at least as much as an uncompressed answer, '' for an
 * uncompressed answer, null when it accepts neither (Next answers those). No header, or an empty
 * one, means uncompressed, as Next's compression does. Codings other than gzip and identity are
 * never chosen: a client that prefers br or deflate but accepts gzip gets gzip, which it accepts.
 */
export function acceptedEncoding(header: string | undefined): 'gzip' | '' | null {
  if (!header || !header.trim()) return '';
  const q: Record<string, number> = {};
  for (const part of header.split(',')) {
    const [name, ...params] = part.trim().toLowerCase().split(';');
    if (!name) continue;
    const qParam = params.map((p) => p.trim()).find((p) => p.startsWith('q='));
    const value = qParam === undefined ? 1 : Number(qParam.slice(2));
    q[name.trim()] = Number.isFinite(value) ? Math.min(Math.max(value, 0), 1) : 0;
  }
  const gzip = q.gzip ?? q['x-gzip'] ?? q['*'] ?? 0;
  // Unnamed, no coding weighs as the lowest weight the client gave (as the negotiator in Next's
  // compression reckons it), so `gzip;q=0.5` alone still means gzip.
  const lowest = Math.min(1, ...Object.values(q).filter((v) => v > 0));
  const identity = q.identity ?? (q['*'] === 0 ? 0 : lowest);
  if (gzip > 0 && gzip >= identity) return 'gzip';
  if (identity > 0) return '';
  return gzip > 0 ? 'gzip' : null;
}

/** The headers to send with a recorded variant: its request's Accept-Encoding and X-Forwarded-Proto. */
export function recordingHeaders(variant: string): Record<string, string> {
  const space = variant.indexOf(' ');
  const headers: Record<string, string> = { [RECORD_HEADER]: '1' };
  if (variant.slice(0, space) === 'https') headers['x-forwarded-proto'] = 'https';
  // Node's client sends no Accept-Encoding of its own, so the uncompressed variant asks with none.
  if (variant.slice(space + 1) === 'gzip') headers['accept-encoding'] = 'gzip';
  return headers;
}

export type RecordedPage = {
  status: number;
  /** Header names and values in Next's order (a flat list, repeated names kept), without the per-connection ones. */
  headers: string[];
  /** The same with the body's Content-Length, for a 200. */
  headersWithLength: string[];
  etag: string | undefined;
  body: Buffer;
};

// Written per response by Node itself (Date, the connection's), or recomputed (Content-Length).
const PER_RESPONSE = new Set(['date', 'connection', 'keep-alive', 'transfer-encoding', 'content-length']);

/**
 * Keeps a response of Next for reuse, or null when it must not be reused: anything but a 200 of a
 * prerendered page, or one that sets a cookie or says private / no-store.
 */
export function recordable(status: number, rawHeaders: string[], body: Buffer): RecordedPage | null {
  if (status !== 200) return null;
  const headers: string[] = [];
  let prerendered = false;
  let etag: string | undefined;
  for (let i = 0; i < rawHeaders.length; i += 2) {
    const name = rawHeaders[i].toLowerCase();
    const value = rawHeaders[i + 1];
    if (name === 'set-cookie') return null;
    if (name === 'cache-control' && /private|no-store|no-cache/i.test(value)) return null;
    if (name === 'x-nextjs-prerender') prerendered = true;
    if (name === 'etag') etag = value;
    if (!PER_RESPONSE.has(name)) headers.push(rawHeaders[i], value);
  }
  if (!prerendered) return null;
  headers.push(HIT_HEADER, 'hit');
  return { status, headers, headersWithLength: [...headers, 'Content-Length', String(body.length)], etag, body };
}

/** True when the request's If-None-Match names the page's ETag (or *), as Next's own 304 decides. */
export function notModified(ifNoneMatch: string | string[] | undefined, etag: string | undefined): boolean {
  if (!etag || typeof ifNoneMatch !== 'string') return false;
  if (ifNoneMatch.trim() === '*') return true;
  const strip = (tag: string) => tag.trim().replace(/^W\//, '');
  const want = strip(etag);
  return ifNoneMatch.split(',').some((tag) => strip(tag) === want);
}

/** The memory of recorded pages: per path, its (at most four) variants. */
export class StaticPageCache {
  readonly pages: ReadonlySet<string>;
  private readonly recorded = new Map<string, Map<string, RecordedPage>>();
  private readonly pending = new Set<string>();

  constructor(paths: Iterable<string>) {
    this.pages = new Set(paths);
  }

  get(path: string, variant: string): RecordedPage | undefined {
    return this.recorded.get(path)?.get(variant);
  }

  /** Whether a miss for this variant should start a recording (none running for it). */
  shouldRecord(path: string, variant: string): boolean {
    const key = `${path}\n${variant}`;
    if (this.pending.has(key)) return false;
    this.pending.add(key);
    return true;
  }

  /** Ends a recording started by shouldRecord: keeps the page, or (null) lets a later miss try again. */
  finish(path: string, variant: string, page: RecordedPage | null): void {
    this.pending.delete(`${path}\n${variant}`);
    if (!page) return;
    let variants = this.recorded.get(path);
    if (!variants) this.recorded.set(path, (variants = new Map()));
    variants.set(variant, page);
  }

  get size(): number {
    let n = 0;
    for (const variants of this.recorded.values()) n += variants.size;
    return n;
  }
}

/** Writes a recorded page: a 304 when the client has it, headers only for HEAD. */
export function sendRecorded(req: IncomingMessage, res: ServerResponse, page: RecordedPage): void {
  if (notModified(req.headers['if-none-match'], page.etag)) {
    res.writeHead(304, page.headers);
    res.end();
    return;
  }
  res.writeHead(page.status, page.headersWithLength);
  res.end(req.method === 'HEAD' ? undefined : page.body);
}

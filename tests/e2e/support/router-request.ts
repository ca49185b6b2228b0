// Router (RSC) requests as the App Router's client sends them on a navigation, with a state tree
// claiming that every layout above the page is already on screen. The server then renders only
// the page below them, so a check that lives only in a layout never runs: the authorization walk
// sends these to prove that every page checks access itself (or in its data function).
import path from 'node:path';
import { discoverRoutes } from '../../support/app-routes';
import { send, type Jar } from './http';

type Segment = string | [name: string, value: string, type: 'd' | 'c' | 'oc', siblings: null];
type StateTree = [Segment, Record<string, StateTree>];

/** The folders of the app route that renders `pattern` (route groups kept: they are layouts too). */
function routeFolders(pattern: string): string[] {
  const page = discoverRoutes().find((r) => r.kind === 'page' && r.pattern === pattern);
  if (!page) throw new Error(`no page under app/ renders ${pattern}`);
  return path.dirname(page.file).split(path.sep).slice(1);
}

/**
 * The Next-Router-State-Tree of a client that shows every layout of `pattern` for `pathname`, with
 * the page itself shown without a query string: a request for the same page with a query is then
 * answered by rendering the page alone. Dynamic values come from the path, segment by segment.
 */
export function claimedStateTree(pattern: string, pathname: string): string {
  const values = pathname.split('/').filter(Boolean).map(decodeURIComponent);
  let index = 0;
  const segments: Segment[] = routeFolders(pattern).map((folder) => {
    if (/^\(.*\)$/.test(folder)) return folder;
    const dynamic = /^\[(\[)?(\.\.\.)?(\w+)\]?\]$/.exec(folder);
    if (!dynamic) {
      index += 1;
      return folder;
    }
    const [, optional, catchAll, name] = dynamic;
    if (catchAll) {
      const rest = values.slice(index).join('/');
      index = values.length;
      return [name, rest, optional ? 'oc' : 'c', null];
    }
    return [name, values[index++] ?? '', 'd', null];
  });
  let tree: StateTree = ['__PAGE__', {}];
  for (const segment of [...segments].reverse()) tree = [segment, { children: tree }];
  return encodeURIComponent(JSON.stringify(['', { children: tree }]));
}

/** `path` with one more query parameter, so that it differs from the page the tree claims. */
export function withWalkQuery(target: string): string {
  return target + (target.includes('?') ? '&' : '?') + 'router-walk=1';
}

/**
 * A router request for `target` claiming the layouts of `pattern`; follows Next's cache-busting
 * redirects (a 307 to the same address with `_rsc=` added), as the client router does.
 */
export async function sendRouterRequest(pattern: string, target: string, options: { jar?: Jar; headers?: Record<string, string> } = {}): Promise<Response> {
  const address = withWalkQuery(target);
  const tree = claimedStateTree(pattern, new URL(address, 'http://x').pathname);
  const headers = { ...(options.headers ?? {}), rsc: '1', 'next-router-state-tree': tree };
  let next = address;
  for (let hop = 0; hop < 3; hop++) {
    const response = await send(next, { headers, jar: options.jar });
    const location = response.headers.get('location');
    if (response.status !== 307 || !location || !new URL(location, 'http://x').searchParams.has('_rsc')) return response;
    next = location;
  }
  throw new Error(`router request for ${target} kept being redirected`);
}

const ENTITIES: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', '#39': "'", '#x27': "'", nbsp: ' ' };

/** The text of HTML pages (streamed parts arrive after <main>), head, tags and scripts removed and common entities decoded. */
function bodyText(html: string): string {
  const body = html.replace(/<head\b[\s\S]*?<\/head>/gi, ' ');
  return body
    .replace(/<(script|style|template)\b[\s\S]*?<\/\1>/gi, ' ')
    .replace(/<[^>]+>/g, '\n')
    .replace(/&(#?\w+);/g, (whole, name: string) => ENTITIES[name] ?? whole);
}

/**
 * Sentences of a page's own content that a refused request must not carry: runs of plain words at
 * least 30 characters long in `allowedHtml`'s body (characters that the HTML or the router's
 * payload would escape differently are left out), minus any that a visitor reads anyway in
 * `publicHtml` (the public pages: the site's header and footer, course and lesson titles).
 */
export function privateSentences(allowedHtml: string, publicHtml: string): string[] {
  const shell = bodyText(publicHtml);
  const found = bodyText(allowedHtml)
    .split(/\n+/)
    .flatMap((chunk) => chunk.split(/(?<=[.!?])\s+/))
    .map((s) => s.replace(/\s+/g, ' ').trim())
    .filter((s) => s.length >= 30 && /^[A-Za-z0-9 ,.;:()%/-]+$/.test(s) && !shell.includes(s));
  return [...new Set(found)];
}

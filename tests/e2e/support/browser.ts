import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createRequire } from 'node:module';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

const AXE_SOURCE = fs.readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

export const baseUrl = () => {
  const url = process.env.E2E_BASE_URL;
  if (!url) throw new Error('E2E_BASE_URL is not set: the e2e global setup did not run');
  return url;
};

/** A fresh Debian headless Chromium (chromium-headless-shell, which scripts/lib.sh installs) with an empty profile (relative addresses go to `base`, the e2e app by default). */
export async function openBrowser(
  base: string = baseUrl(),
): Promise<{ context: BrowserContext; page: Page; network: ReturnType<typeof watchNetwork>; close: () => Promise<void> }> {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'brinewright-e2e-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium-headless-shell',
    headless: true,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
    baseURL: base,
  });
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    network: watchNetwork(page),
    close: async () => {
      await context.close();
      fs.rmSync(profile, { recursive: true, force: true });
    },
  };
}

export type AxeViolation = { id: string; impact: string | null; help: string; nodes: { target: string[] }[] };

/** Runs axe-core in the page and returns the serious and critical violations. */
export async function seriousViolations(page: Page): Promise<AxeViolation[]> {
  // After a client-side navigation Next sets the new document title once the page's metadata has
  // streamed in, which can be a moment after its content shows. Wait for a title (at most 5 s);
  // a page without one is still reported by axe below.
  await page.waitForFunction(() => document.title.trim() !== '', undefined, { timeout: 5_000 }).catch(() => undefined);
  // Once per document: a second run on the same page (after a resize, say) reuses it.
  if (!(await page.evaluate(() => 'axe' in window))) await page.addScriptTag({ content: AXE_SOURCE });
  const violations = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document, opts: object) => Promise<{ violations: AxeViolation[] }> } }).axe;
    const result = await axe.run(document, { resultTypes: ['violations'] });
    return result.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.map((n) => ({ target: n.target })) }));
  });
  return violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
}

/** Signs in through the form as a person would. */
export async function signIn(page: Page, email: string, password: string) {
  await page.goto('/signin');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('signed-in-as').waitFor();
}

/**
 * Follows the page's requests so a test can wait for its network to go quiet, and, when it does
 * not, name the requests still open (Playwright's `networkidle` only says that it timed out).
 * Start it before the first navigation it should cover (openBrowser starts one as `network`).
 * Link prefetches (the `next-router-prefetch` header) are not followed.
 * E2E_LOG_REQUESTS=1 prints each request and how long it took.
 */
export function watchNetwork(page: Page) {
  const open = new Map<object, { url: string; since: number }>();
  let lastChange = Date.now();
  page.on('request', (request) => {
    // Next's <Link> prefetches the routes its visible links point to; they are the router's
    // speculation, not the page's content, and the browser may hold them open at low priority.
    if (request.headers()['next-router-prefetch']) return;
    open.set(request, { url: `${request.method()} ${request.url()}`, since: Date.now() });
    if (process.env.E2E_LOG_REQUESTS) console.log('[req]', request.method(), request.url());
    lastChange = Date.now();
  });
  const done = (request: object) => {
    if (process.env.E2E_LOG_REQUESTS) {
      const r = open.get(request);
      if (r) console.log('[done]', r.url, Date.now() - r.since, 'ms');
    }
    open.delete(request);
    lastChange = Date.now();
  };
  page.on('requestfinished', done);
  page.on('requestfailed', done);
  return {
    /** Resolves once no request has been open for `quietMs`; after `timeoutMs` fails naming the open ones. */
    async quiet({ quietMs = 500, timeoutMs = 30_000 } = {}) {
      const start = Date.now();
      for (;;) {
        if (open.size === 0 && Date.now() - lastChange >= quietMs) return;
        if (Date.now() - start > timeoutMs) {
          const now = Date.now();
          const list = [...open.values()].map((r) => `${r.url} (open ${now - r.since} ms)`);
          throw new Error(`the page's network did not go quiet in ${timeoutMs} ms; open: ${list.join(', ') || 'none (requests kept starting)'}`);
        }
        await new Promise((resolve) => setTimeout(resolve, 100));
      }
    },
  };
}

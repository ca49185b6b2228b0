import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowser, seriousViolations, signIn } from './support/browser';
import { send, setCookiesOf, signInHttp } from './support/http';
import { securityHeaderProblems } from './support/security-headers';

describe('security headers, session cookies and the cross-site write check', () => {
  it('sends the security headers on pages, route handlers, redirects, 404s and static files', async () => {
    const home = await send('/');
    expect(home.status).toBe(200);
    const html = await home.text();
    const asset = html.match(/\/_next\/static\/[^"']+\.(?:js|css)/)?.[0];
    expect(asset, 'the home page links a static asset').toBeTruthy();
    const responses: [string, Response][] = [['/', home]];
    for (const p of [
      '/courses',
      '/learn/pickling-and-canning/acidity',
      '/signin',
      '/api/health',
      '/api/tools/boiling-point?altitudeFt=1000',
      '/pantry',
      '/api/pantry',
      '/no-such-page',
      asset!,
    ]) {
      responses.push([p, await send(p)]);
    }
    const statuses = Object.fromEntries(responses.map(([p, r]) => [p, r.status]));
    expect(statuses).toMatchObject({ '/pantry': 307, '/api/pantry': 401, '/no-such-page': 404, [asset!]: 200 });
    const problems = responses.flatMap(([p, r]) => securityHeaderProblems(r).map((problem) => `${p}: ${problem}`));
    expect(problems).toEqual([]);

    const csp = home.headers.get('content-security-policy')!;
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).not.toContain('unsafe-eval');
    // Plain http on 127.0.0.1: no HSTS (browsers ignore it on http). Behind a TLS proxy it is sent.
    expect(home.headers.get('strict-transport-security')).toBeNull();
    const proxied = await send('/', { headers: { 'x-forwarded-proto': 'https' } });
    expect(proxied.headers.get('strict-transport-security')).toMatch(/^max-age=\d{7,}/);
  });

  it('sets the session cookie httpOnly and SameSite=Lax (and the CSRF cookie too)', async () => {
    const { jar, signInResponse } = await signInHttp('learner@cedarhollow.example', 'demo-learner-pass');
    expect(signInResponse.status).toBe(200);
    const cookies = setCookiesOf(signInResponse);
    const session = cookies.find((c) => /next-auth\.session-token=/.test(c));
    expect(session, cookies.join('\n')).toBeTruthy();
    expect(session).toMatch(/;\s*HttpOnly/i);
    expect(session).toMatch(/;\s*SameSite=Lax/i);
    expect(session).toMatch(/;\s*Path=\//i);
    const csrf = await send('/api/auth/csrf');
    const csrfCookie = setCookiesOf(csrf).find((c) => /next-auth\.csrf-token=/.test(c));
    expect(csrfCookie).toMatch(/;\s*HttpOnly/i);
    expect(csrfCookie).toMatch(/;\s*SameSite=Lax/i);
    // The cookie really is the session: the Pantry's data route answers with it and refuses without it.
    expect((await send('/api/pantry', { jar })).status).toBe(200);
    expect((await send('/api/pantry')).status).toBe(401);
  });

  it('refuses the workshop form’s write posted with a foreign Origin, with the coordinator’s cookie, and runs it from the app’s own origin', async () => {
    const { jar } = await signInHttp('coordinator@cedarhollow.example', 'demo-coordinator-pass');
    const base = new URL(process.env.E2E_BASE_URL!);
    // An empty workshop: let through, the route answers with its field errors and saves nothing.
    const post = (origin: string) => send('/api/desk/workshops', { method: 'POST', jar, body: { place: '' }, headers: { origin } });

    const own = await post(base.origin);
    const ownBody = (await own.json()) as { fields?: Record<string, string[]> };
    expect(own.status).toBe(400);
    expect(ownBody.fields?.place).toEqual(['Enter the place (at least 3 characters).']);

    const foreign = await post('https://attacker.example');
    expect(foreign.status).toBe(403);
    expect(await foreign.text()).not.toContain('Enter the place');

    // A sandboxed frame sends Origin: null: cross-site too.
    const opaque = await post('null');
    expect(opaque.status).toBe(403);
    expect(await opaque.text()).not.toContain('Enter the place');
  });
});

type Violation = { directive: string; blocked: string; source?: string };

/** Collects CSP violations (securitypolicyviolation events) and CSP console errors of a page. */
async function watchCsp(page: Page) {
  const consoleErrors: string[] = [];
  page.on('console', (message) => {
    if (/content security policy|refused to/i.test(message.text())) consoleErrors.push(message.text());
  });
  await page.addInitScript(() => {
    const w = window as unknown as { __csp: Violation[] };
    w.__csp = [];
    document.addEventListener('securitypolicyviolation', (e) => w.__csp.push({ directive: e.violatedDirective, blocked: e.blockedURI, source: e.sourceFile }));
  });
  return {
    consoleErrors,
    violations: () => page.evaluate(() => (window as unknown as { __csp: Violation[] }).__csp),
  };
}

describe('the content security policy in the browser', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;

  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('catches a violation when one happens (the watcher works, eval is blocked)', async () => {
    const { page } = browser;
    const csp = await watchCsp(page);
    await page.goto('/courses');
    await page.evaluate(() => {
      const img = document.createElement('img');
      img.src = 'https://images.invalid/pixel.png';
      img.alt = '';
      document.body.append(img);
    });
    await expect.poll(async () => (await csp.violations()).map((v) => v.directive)).toContain('img-src');
    // Chromium exempts script that DevTools injects (page.evaluate, its script elements) from the
    // page's CSP, so eval is tried by a document's own inline script, served with the app's real policy.
    const policy = (await send('/courses')).headers.get('content-security-policy')!;
    await page.route('**/__csp-probe', (route) =>
      route.fulfill({
        status: 200,
        contentType: 'text/html',
        headers: { 'content-security-policy': policy },
        body: '<!doctype html><html lang="en"><head><title>CSP probe</title></head><body><main><h1>CSP probe</h1></main><script>try { window.__evalRan = eval("1 + 1") === 2 } catch (e) { window.__evalRan = "blocked: " + e.name }</script></body></html>',
      }),
    );
    await page.goto('/__csp-probe');
    expect(await page.evaluate(() => (window as unknown as { __evalRan?: unknown }).__evalRan)).toBe('blocked: EvalError');
    await expect.poll(async () => (await csp.violations()).map((v) => v.blocked)).toContain('eval');
    expect(await seriousViolations(page)).toEqual([]);
  });

  it('shows the main pages with no CSP violation: lessons and calculators, sign-in, Pantry, quiz, desk, reports, Tasting table, photos, fonts', async () => {
    const { page } = browser;
    const csp = await watchCsp(page);
    const seen: Record<string, Violation[]> = {};
    const check = async (label: string) => {
      await browser.network.quiet();
      seen[label] = await csp.violations();
      expect(await seriousViolations(page), label).toEqual([]);
    };

    await page.goto('/');
    await check('home');
    // Merriweather is served from the app's own origin and actually loads.
    const fontsLoaded = await page.evaluate(async () => {
      await document.fonts.ready;
      return [...document.fonts].filter((f) => f.family.includes('Merriweather') && f.status === 'loaded').length;
    });
    expect(fontsLoaded).toBeGreaterThan(0);

    await page.goto('/learn/pickling-and-canning/acidity');
    const calculator = page.getByRole('region', { name: 'Brine acidity' });
    await calculator.getByLabel('Vinegar', { exact: true }).fill('1000');
    await calculator.getByLabel('Water', { exact: true }).fill('500');
    await expect.poll(() => calculator.getByTestId('brine-acid').textContent()).toBe('3.33 g per 100 mL');
    await check('lesson with the brine calculator');

    await page.goto('/bench');
    await check('Brine bench');

    await signIn(page, 'learner@cedarhollow.example', 'demo-learner-pass');
    await check('sign-in and the page after it');
    await page.goto('/pantry');
    await page.getByRole('heading', { level: 1 }).waitFor();
    await check('Pantry');
    await page.goto('/quiz/pickling-and-canning--acidity');
    await page.getByRole('heading', { level: 1 }).waitFor();
    await check('quiz');
    await page.goto('/learn/pickling-and-canning/processing');
    await page
      .getByRole('region', { name: /processing time/i })
      .first()
      .waitFor();
    await check('members-only lesson with three calculators');

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('link', { name: 'Sign in' }).waitFor();
    await signIn(page, 'coordinator@cedarhollow.example', 'demo-coordinator-pass');
    await page.goto('/desk');
    await page.getByRole('heading', { name: 'Certificate desk', level: 1 }).waitFor();
    await check('Certificate desk');
    await page.goto('/desk/reports');
    await page.locator('.recharts-surface').first().waitFor();
    await check('reports with charts');
    await page.goto('/tasting-table');
    await page.getByRole('heading', { level: 1 }).waitFor();
    await check('Tasting table');
    const submission = page.getByRole('link', { name: /Idris Fairweather|Lena Marsh|Review/ }).first();
    await submission.click();
    await page.waitForURL('**/tasting-table/submissions/**');
    const photo = page.locator('img[src^="/api/photos/"]').first();
    await photo.waitFor();
    await expect.poll(() => photo.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBeGreaterThan(0);
    await check('a submission with its photos');

    expect(seen).toEqual(Object.fromEntries(Object.keys(seen).map((k) => [k, []])));
    expect(csp.consoleErrors).toEqual([]);
    // Twelve pages with axe on each: about 80 s on a quiet machine, allow a loaded one more.
  }, 240_000);
});

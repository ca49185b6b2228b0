import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadLessons } from '../../lib/content/loader';
import { openBrowser, seriousViolations, signIn } from './support/browser';
import { send, signInHttp } from './support/http';

const content = path.resolve(__dirname, '../../content');
const lessons = loadLessons(content, 'pickling-and-canning');
const preview = lessons.find((l) => l.slug === 'acidity')!;
const membersOnly = lessons.find((l) => l.slug === 'processing')!;
const membersPath = `/learn/pickling-and-canning/${membersOnly.slug}`;

describe('lessons in the browser', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;

  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('the catalog and the course page list the courses, the fee and the lessons', async () => {
    const { page } = browser;
    await page.goto('/courses');
    await page.getByRole('link', { name: 'Safe Pickling and Water-Bath Canning' }).click();
    await page.waitForURL('**/courses/pickling-and-canning');
    await page.getByRole('heading', { level: 1, name: 'Safe Pickling and Water-Bath Canning' }).waitFor();
    expect(await page.getByRole('region', { name: 'Course fee' }).textContent()).toContain('$45.00');
    const lessonList = page.getByRole('list').filter({ has: page.getByRole('link', { name: preview.title }) });
    expect(await lessonList.getByRole('listitem').count()).toBe(lessons.length);
    expect(await seriousViolations(page)).toEqual([]);
  });

  it('sends public pages with a Cache-Control of minutes for the proxy or a CDN, and a signed-in reader’s lessons private', async () => {
    const publicPages = ['/courses', '/courses/pickling-and-canning', `/learn/pickling-and-canning/${preview.slug}`, '/bench'];
    for (const url of publicPages) {
      const response = await send(url);
      await response.arrayBuffer();
      expect(response.status, url).toBe(200);
      // Prerendered pages: revalidate = 300 in the root layout, expireTime 600; the lesson route (per request): next.config.mjs headers().
      expect(response.headers.get('cache-control'), url).toBe('s-maxage=300, stale-while-revalidate=300');
    }
    // A visitor is sent to sign in; the redirect is the same for every visitor.
    const members = await send(membersPath);
    await members.arrayBuffer();
    expect(members.status).toBe(307);
    expect(members.headers.get('location')).toContain('/signin?callbackUrl=');
    // With the session cookie every lesson answer is the reader's own: the preview lesson too.
    const { jar } = await signInHttp('learner@cedarhollow.example', 'demo-learner-pass');
    for (const url of [membersPath, `/learn/pickling-and-canning/${preview.slug}`]) {
      const response = await send(url, { jar });
      const html = await response.text();
      expect(response.status, url).toBe(200);
      expect(html, url).toContain('data-lesson-body');
      expect(response.headers.get('cache-control'), url).toBe('private, no-cache, no-store, max-age=0, must-revalidate');
    }
  });

  it('opens a public lesson and uses its embedded brine calculator', async () => {
    const { page } = browser;
    const response = await page.goto(`/learn/pickling-and-canning/${preview.slug}`);
    expect(response?.status()).toBe(200);
    await browser.network.quiet();
    expect(await page.getByRole('heading', { level: 1, name: preview.title }).count()).toBe(1);
    const toc = page.getByRole('navigation', { name: 'In this lesson' });
    expect(await toc.getByRole('link').count()).toBeGreaterThan(2);
    expect(await page.getByRole('heading', { name: 'After this lesson you can' }).count()).toBe(1);
    expect(await page.getByRole('heading', { name: 'Sources' }).count()).toBe(1);

    // The table of contents links to the headings the MDX pipeline gave ids.
    const firstHref = await toc.getByRole('link').first().getAttribute('href');
    expect(firstHref).toMatch(/^#[a-z0-9-]+$/);
    expect(await page.locator(`h2${firstHref}`).count()).toBe(1);

    // 1000 mL of 5% vinegar and 500 mL of water: 50 g of acetic acid in 1500 mL = 3.33 g per 100 mL
    // (vinegar strength is grams of acetic acid per 100 mL, FDA Compliance Policy Guide Sec. 525.825).
    const calculator = page.getByRole('region', { name: 'Brine acidity' });
    await calculator.getByLabel('Vinegar', { exact: true }).fill('1000');
    await calculator.getByLabel('Water', { exact: true }).fill('500');
    await expect.poll(() => calculator.getByTestId('brine-acid').textContent()).toBe('3.33 g per 100 mL');

    // A bad value shows the message instead of a number.
    await calculator.getByLabel('Water', { exact: true }).fill('-5');
    await expect.poll(() => calculator.getByTestId('brine-acid').count()).toBe(0);
    await calculator.getByLabel('Water', { exact: true }).fill('500');
    await expect.poll(() => calculator.getByTestId('brine-acid').textContent()).toBe('3.33 g per 100 mL');
    expect(await seriousViolations(page)).toEqual([]);
  });

  it('on a phone-sized screen puts the contents after the lesson title, with one navigation by that name', async () => {
    const page = await browser.context.newPage();
    try {
      await page.setViewportSize({ width: 390, height: 844 });
      await page.goto(`/learn/pickling-and-canning/${preview.slug}`);
      const title = page.getByRole('heading', { level: 1, name: preview.title });
      const toc = page.getByRole('navigation', { name: 'In this lesson' });
      expect(await toc.count()).toBe(1);
      const [titleBox, tocBox] = [await title.boundingBox(), await toc.boundingBox()];
      expect(tocBox!.y).toBeGreaterThan(titleBox!.y + titleBox!.height);
      expect(await seriousViolations(page)).toEqual([]);
      await page.setViewportSize({ width: 1280, height: 800 });
      expect(await toc.count()).toBe(1);
      // On a wide screen the side column holds them, level with the top of the lesson.
      expect((await toc.boundingBox())!.y).toBeLessThan((await title.boundingBox())!.y + 200);
    } finally {
      await page.close();
    }
  });

  it('prints a lesson as a handout: no site header, no navigation, a note where the calculator was', async () => {
    const { page } = browser;
    await page.goto(`/learn/pickling-and-canning/${preview.slug}`);
    await page.emulateMedia({ media: 'print' });
    expect(await page.locator('header[data-site-header]').isVisible()).toBe(false);
    expect(await page.getByRole('navigation', { name: 'In this lesson' }).isVisible()).toBe(false);
    expect(await page.getByRole('region', { name: 'Brine acidity' }).isVisible()).toBe(false);
    expect(await page.locator('[data-print-note]').first().isVisible()).toBe(true);
    expect(await page.getByRole('heading', { level: 1, name: preview.title }).isVisible()).toBe(true);
    await page.emulateMedia({ media: 'screen' });
  });

  it('refuses a members-only lesson to a signed-out visitor', async () => {
    const { context } = browser;
    await context.clearCookies();
    const page = await context.newPage();
    await page.goto(membersPath);
    await page.waitForURL(`**/signin?callbackUrl=${encodeURIComponent(membersPath)}`);
    await page.close();
  });

  it('offers enrollment, with status 403, to a learner who is not enrolled', async () => {
    const { page } = browser;
    await page.goto('/register');
    await page.getByLabel('Your name').fill('Ines Calloway');
    await page.getByLabel('E-mail').fill(`ines-${Date.now()}@test.example`);
    await page.getByLabel('Password').fill('vinegar at five percent');
    await page.getByRole('button', { name: 'Create my account' }).click();
    await page.waitForURL('**/pantry');
    const response = await page.goto(membersPath);
    expect(response?.status()).toBe(403);
    expect(await page.getByRole('heading', { name: 'This lesson is for enrolled learners' }).count()).toBe(1);
    expect(await page.getByRole('link', { name: 'Enroll in the course' }).getAttribute('href')).toBe('/courses/pickling-and-canning#workshops');
    expect(await page.getByText(membersOnly.objectives[0]).count()).toBe(0);
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('link', { name: 'Sign in' }).waitFor();
  });

  it('opens a members-only lesson for the demo learner, who has an active enrollment', async () => {
    const { page } = browser;
    await signIn(page, 'learner@cedarhollow.example', 'demo-learner-pass');
    const response = await page.goto(membersPath);
    expect(response?.status()).toBe(200);
    expect(page.url()).toMatch(new RegExp(`${membersPath}$`));
    // Per-request page with a loading state: wait for the streamed lesson before counting.
    await page.getByRole('heading', { level: 1, name: membersOnly.title }).waitFor();
    expect(await page.getByRole('heading', { level: 1, name: membersOnly.title }).count()).toBe(1);
    expect(await page.getByText(membersOnly.objectives[0]).count()).toBe(1);
    expect(await page.getByRole('link', { name: /Previous: lesson/ }).getAttribute('href')).toBe(
      `/learn/pickling-and-canning/${lessons[membersOnly.order - 2].slug}`,
    );
    await browser.network.quiet();
    expect(await seriousViolations(page)).toEqual([]);
  });

  it('shows that a header link was taken while its page is on the way (the learner is still signed in)', async () => {
    const { page } = browser;
    // Hold the Pantry's router requests for a moment, as a slow server would.
    let release!: () => void;
    const held = new Promise<void>((resolve) => (release = resolve));
    await page.route(/\/pantry\?_rsc=/, async (route) => {
      await held;
      await route.continue();
    });
    try {
      const nav = page.getByRole('navigation', { name: 'Your pages' });
      await nav.getByRole('link', { name: 'Pantry' }).click();
      const bar = nav.locator('[data-link-pending]');
      await bar.waitFor();
      // Hidden for the first 150 ms, then visible (the CSS animation's delay).
      await expect.poll(() => bar.evaluate((el) => Number(getComputedStyle(el).opacity))).toBeGreaterThan(0.3);
      expect(page.url()).toMatch(new RegExp(`${membersPath}$`));
      release();
      await page.waitForURL('**/pantry');
      await page.getByRole('heading', { level: 1 }).waitFor();
      await bar.waitFor({ state: 'detached' });
    } finally {
      release();
      await page.unroute(/\/pantry\?_rsc=/);
    }
  });

  it('goes from the Pantry to a members-only lesson and on to the next one in the same document, through the router', async () => {
    const { page } = browser;
    await page.goto('/pantry');
    await browser.network.quiet();
    // The router's requests for the lessons, and a mark that only a full page load would wipe.
    const routerAnswers: { url: string; status: number }[] = [];
    const onResponse = (response: import('playwright-core').Response) => {
      const url = new URL(response.url());
      if (url.pathname.startsWith('/learn/') && url.searchParams.has('_rsc')) routerAnswers.push({ url: url.pathname, status: response.status() });
    };
    page.on('response', onResponse);
    await page.evaluate(() => ((window as unknown as { sameDocument: boolean }).sameDocument = true));
    try {
      await page.locator(`a[href="${membersPath}"]`).first().click();
      await page.waitForURL(`**${membersPath}`);
      await page.getByRole('heading', { level: 1, name: membersOnly.title }).waitFor();
      const next = lessons[membersOnly.order];
      await page.getByRole('link', { name: /Next: lesson/ }).click();
      await page.waitForURL(`**/learn/pickling-and-canning/${next.slug}`);
      await page.getByRole('heading', { level: 1, name: next.title }).waitFor();
      expect(await page.evaluate(() => (window as unknown as { sameDocument?: boolean }).sameDocument)).toBe(true);
      await browser.network.quiet();
      // Both lessons came as router answers (prefetches included), and none failed: before the
      // rewrite was an afterFiles one, Next answered these with a 500 and the browser reloaded the page.
      expect(routerAnswers.filter((a) => a.status !== 200)).toEqual([]);
      expect(routerAnswers.map((a) => a.url)).toEqual(expect.arrayContaining([membersPath, `/learn/pickling-and-canning/${next.slug}`]));
    } finally {
      page.off('response', onResponse);
    }
  });

  it('asks a visitor on a public lesson nothing about progress, and offers to sign in', async () => {
    const { context } = browser;
    await context.clearCookies();
    const page = await context.newPage();
    const failed: string[] = [];
    page.on('response', (response) => {
      if (response.status() >= 400) failed.push(`${response.status()} ${response.url()}`);
    });
    await page.goto(`/learn/pickling-and-canning/${preview.slug}`);
    const actions = page.getByTestId('lesson-actions');
    await actions.getByText('to keep track of the lessons you read').waitFor();
    expect(await actions.getByRole('link', { name: 'Sign in' }).getAttribute('href')).toBe(
      `/signin?callbackUrl=${encodeURIComponent(`/learn/pickling-and-canning/${preview.slug}`)}`,
    );
    expect(failed).toEqual([]);
    await page.close();
  });
});

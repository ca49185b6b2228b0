// Every page of the authorization matrix, opened by the narrowest person allowed to see it (and the
// public pages by a visitor too), at a 390 px phone and at 1280 px: no page is wider than the
// screen, and axe finds nothing serious at either width (scrollable-region-focusable included).
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createAuthorizationFixtures, FIXTURE_PASSWORD } from './support/authorization-fixtures';
import { MATRIX, type Fixtures, type PageRow, type Subject } from './support/authorization-matrix';
import { openBrowser, seriousViolations, signIn } from './support/browser';

const PHONE = { width: 390, height: 844 };
const DESKTOP = { width: 1280, height: 800 };

// The person who opens each page: the first in this order that the matrix lets in.
// The demo instructor is the matrix's volunteer (an instructor who is also a learner).
const WALKERS: Subject[] = ['own', 'volunteer', 'coordinator', 'admin'];
const PASSWORDS: Record<string, string> = {
  volunteer: 'demo-instructor-pass',
  coordinator: 'demo-coordinator-pass',
  admin: 'demo-admin-pass',
};
const EMAILS: Record<string, string> = {
  volunteer: 'instructor@cedarhollow.example',
  coordinator: 'coordinator@cedarhollow.example',
  admin: 'admin@cedarhollow.example',
};

type Browser = Awaited<ReturnType<typeof openBrowser>>;
type Problem = { page: string; who: Subject; width: number; what: string };

async function widthProblem(page: Page): Promise<string | null> {
  const m = await page.evaluate(() => ({
    scroll: document.documentElement.scrollWidth,
    inner: window.innerWidth,
    // The widest elements that stick out, to name in the failure.
    wide: [...document.querySelectorAll('body *')]
      .filter((el) => el.getBoundingClientRect().right > window.innerWidth + 1)
      // Inside a scrolling region only what escapes it counts: the region itself, or something absolutely placed.
      .filter((el) => {
        const region = el.closest('[role="region"][tabindex="0"]');
        return !region || region === el || ['absolute', 'fixed'].includes(getComputedStyle(el).position);
      })
      .slice(0, 3)
      .map(
        (el) =>
          `${el.tagName.toLowerCase()}${el.id ? `#${el.id}` : ''}.${String(el.className).slice(0, 60)} → ${Math.round(el.getBoundingClientRect().right)}px`,
      ),
  }));
  return m.scroll <= m.inner ? null : `page is ${m.scroll}px wide in a ${m.inner}px window (${m.wide.join('; ')})`;
}

describe('every page fits a 390 px phone and passes axe at 390 px and 1280 px', () => {
  let fixtures: Fixtures;
  let emails: { a: string; b: string };
  const browsers = new Map<Subject, Browser>();

  beforeAll(async () => {
    ({ fixtures, emails } = await createAuthorizationFixtures());
  }, 120_000);
  afterAll(async () => {
    for (const b of browsers.values()) await b.close();
  });

  async function browserFor(who: Subject): Promise<Browser> {
    let b = browsers.get(who);
    if (b) return b;
    b = await openBrowser();
    // Signed in at desktop width, where the header shows who is signed in without opening the menu.
    await b.page.setViewportSize(DESKTOP);
    if (who === 'own') await signIn(b.page, emails.a, FIXTURE_PASSWORD);
    else if (who !== 'visitor') await signIn(b.page, EMAILS[who], PASSWORDS[who]);
    browsers.set(who, b);
    return b;
  }

  const rows = MATRIX.filter((r): r is PageRow => r.kind === 'page');

  // Each person's visits run in that person's own browser.
  async function walk(subject: Subject, paths: string[], problems: Problem[]): Promise<number> {
    const b = await browserFor(subject);
    let visits = 0;
    for (const path of paths) {
      // Loaded once at phone width; then the same document is widened to 1280 px and checked again.
      await b.page.setViewportSize(PHONE);
      const started = Date.now();
      const response = await b.page.goto(path);
      if (response?.status() !== 200) {
        problems.push({ page: path, who: subject, width: PHONE.width, what: `answered ${response?.status()}` });
        continue;
      }
      // Client leaves (the header's session, SWR tables) load after the document; wait for a quiet network, briefly.
      await b.network.quiet({ quietMs: 300, timeoutMs: 8_000 }).catch(() => undefined);
      for (const size of [PHONE, DESKTOP]) {
        if (size !== PHONE) {
          await b.page.setViewportSize(size);
          // Two frames, so the wider layout is laid out and painted before axe reads it.
          await b.page.evaluate(() => new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(resolve))));
        }
        visits++;
        const found: string[] = [];
        if (size === PHONE) {
          const wide = await widthProblem(b.page);
          if (wide) found.push(wide);
        }
        for (const v of await seriousViolations(b.page)) found.push(`axe ${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
        problems.push(...found.map((what) => ({ page: path, who: subject, width: size.width, what })));
        if (process.env.E2E_LOG_PAGES)
          console.log(`[phone] ${path} as ${subject} at ${size.width}px (${Date.now() - started} ms): ${found.join(' | ') || 'fits, axe clean'}`);
      }
    }
    return visits;
  }

  it('walks each page as its people', async () => {
    const problems: Problem[] = [];
    const paths = new Map<Subject, string[]>();
    for (const row of rows) {
      const allowed = (s: Subject) => row.expect[s] === 200;
      const walker = WALKERS.find(allowed);
      const people: Subject[] = allowed('visitor') ? ['visitor'] : [];
      if (walker) people.push(walker);
      for (const subject of people) {
        paths.set(subject, [...(paths.get(subject) ?? []), row.probe(fixtures, subject).path]);
      }
    }
    // One person after another: the browser files already run two at a time, and five browsers at
    // once beside another file's took the walk from 90 s to 200 s on two cores.
    const visits: number[] = [];
    for (const [subject, list] of paths) visits.push(await walk(subject, list, problems));
    expect(problems.map((p) => `${p.page} as ${p.who} at ${p.width}px: ${p.what}`)).toEqual([]);
    // Every page row was opened at both widths by at least one person.
    expect(visits.reduce((a, b) => a + b, 0)).toBeGreaterThanOrEqual(rows.length * 2);
  }, 1_800_000);

  it('the header folds its links behind a Menu button on a phone', async () => {
    const { page } = await browserFor('coordinator');
    await page.setViewportSize(PHONE);
    await page.goto('/desk');
    const menu = page.getByRole('button', { name: 'Menu' });
    expect(await menu.getAttribute('aria-expanded')).toBe('false');
    const header = page.locator('header[data-site-header]');
    expect(await header.getByRole('link', { name: 'Certificate desk' }).isVisible()).toBe(false);
    await menu.click();
    expect(await menu.getAttribute('aria-expanded')).toBe('true');
    await page.getByRole('navigation', { name: 'Your pages' }).getByRole('link', { name: 'Tasting table' }).click();
    await page.waitForURL('**/tasting-table');
    // The panel closes once the next page is there.
    await expect.poll(() => menu.getAttribute('aria-expanded')).toBe('false');
    await page.setViewportSize(DESKTOP);
    expect(await menu.isVisible()).toBe(false);
    expect(await header.getByRole('link', { name: 'Certificate desk' }).isVisible()).toBe(true);
  }, 60_000);
});

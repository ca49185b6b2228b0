import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowser, seriousViolations, signIn } from './support/browser';

describe('sign-in and roles in the browser', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;

  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('registers a learner who sees the learner navigation and the 403 page on the desk', async () => {
    const { page } = browser;
    await page.goto('/');
    expect(await seriousViolations(page)).toEqual([]);

    await page.goto('/register');
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByLabel('Your name').fill('Wren Castellano');
    await page.getByLabel('E-mail').fill(`wren-${Date.now()}@test.example`);
    await page.getByLabel('Password').fill('short');
    await page.getByRole('button', { name: 'Create my account' }).click();
    await expect.poll(() => page.getByText('Use at least 10 characters for your password.').count()).toBe(1);

    await page.getByLabel('Password').fill('pickles need acid');
    await page.getByRole('button', { name: 'Create my account' }).click();
    await page.waitForURL('**/pantry');
    await page.getByTestId('signed-in-as').waitFor();
    expect(await page.getByTestId('signed-in-as').textContent()).toContain('Learner');
    const yourPages = page.getByRole('navigation', { name: 'Your pages' });
    expect(await yourPages.getByRole('link', { name: 'Pantry' }).count()).toBe(1);
    expect(await yourPages.getByRole('link', { name: 'Certificate desk' }).count()).toBe(0);
    expect(await seriousViolations(page)).toEqual([]);

    const response = await page.goto('/desk');
    expect(response?.status()).toBe(403);
    expect(await page.getByRole('heading', { name: 'This page is for other people in the program' }).count()).toBe(1);
    expect(await seriousViolations(page)).toEqual([]);

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('link', { name: 'Sign in' }).waitFor();
  });

  it('signs in the demo coordinator, who sees the coordinator navigation', async () => {
    const { page } = browser;
    await page.goto('/signin');
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByLabel('E-mail').fill('coordinator@cedarhollow.example');
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('That e-mail address and password do not match an account.').waitFor();

    await signIn(page, 'coordinator@cedarhollow.example', 'demo-coordinator-pass');
    const yourPages = page.getByRole('navigation', { name: 'Your pages' });
    expect(await yourPages.getByRole('link', { name: 'Certificate desk' }).count()).toBe(1);
    expect(await yourPages.getByRole('link', { name: 'Tasting table' }).count()).toBe(1);
    expect(await yourPages.getByRole('link', { name: 'Pantry' }).count()).toBe(0);
    const response = await page.goto('/desk');
    expect(response?.status()).toBe(200);
    await page.getByRole('heading', { name: 'Certificate desk' }).waitFor();
    expect(await seriousViolations(page)).toEqual([]);
  });

  it('sends a signed-out visitor from a protected page to the sign-in page', async () => {
    const { context } = browser;
    await context.clearCookies();
    const page = await context.newPage();
    await page.goto('/tasting-table');
    await page.waitForURL('**/signin?callbackUrl=%2Ftasting-table');
    await page.close();
  });
});

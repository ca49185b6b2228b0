import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowser, seriousViolations } from './support/browser';

describe('the Brine bench in the browser', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;

  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('opens /bench signed out, uses two calculators and stays free of serious axe violations', async () => {
    const { page } = browser;
    const response = await page.goto('/bench');
    expect(response?.status()).toBe(200);
    await page.getByRole('heading', { level: 1, name: 'Brine bench' }).waitFor();
    expect(await page.getByText('They never call a recipe safe.').count()).toBe(1);
    // Every calculator has a heading and a lesson link.
    expect(await page.locator('[data-calculator]').count()).toBe(10);
    expect(await page.getByRole('link', { name: /^Lesson: / }).count()).toBe(10);
    expect(await seriousViolations(page)).toEqual([]);

    // Processing time: quick fresh-pack dill quarts at 7,000 ft → 25 minutes (USDA Complete Guide to
    // Home Canning, rev. 2015, Guide 6 table: 15 / 20 / 25).
    const processing = page.locator('#processing-time');
    await processing.getByLabel('Jar size', { exact: true }).selectOption('quart');
    await processing.getByLabel('Altitude', { exact: true }).fill('7000');
    await expect.poll(() => processing.getByTestId('processing-minutes').textContent()).toContain('25 minutes');
    await processing.getByLabel('Altitude', { exact: true }).fill('12000');
    await expect.poll(() => processing.getByRole('status').textContent()).toContain('local extension office');

    // Brine acidity, typed with the keyboard: 1 L of 5 % vinegar alone → 5 g per 100 mL, pH 2.42 (computed).
    const brine = page.locator('#brine');
    await brine.getByLabel('Water', { exact: true }).click();
    await page.keyboard.press('ControlOrMeta+a');
    await page.keyboard.type('0');
    await brine.getByLabel('Vinegar', { exact: true }).fill('1000');
    await expect.poll(() => brine.getByTestId('brine-acid').textContent()).toContain('5 g per 100 mL');
    expect(await brine.getByTestId('brine-ph').textContent()).toContain('2.42');
    await brine.getByLabel('Vinegar', { exact: true }).fill('-5');
    await expect.poll(() => brine.getByText('The vinegar in mL cannot be negative.').count()).toBe(1);

    expect(await seriousViolations(page)).toEqual([]);
  });

  it('answers the JSON tools without signing in', async () => {
    const { page } = browser;
    const ok = await page.request.get('/api/tools/boiling-point?altitudeFt=5000');
    expect(ok.status()).toBe(200);
    expect(Math.abs(((await ok.json()) as { fahrenheit: number }).fahrenheit - 203)).toBeLessThan(0.2);
    expect((await page.request.get('/api/tools/processing-time?product=dilly-beans&jar=quart&altitudeFt=0')).status()).toBe(422);
  });
});

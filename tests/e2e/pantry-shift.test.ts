// The Pantry on a slow phone: cumulative layout shift while it loads, measured in Chromium through
// the DevTools protocol (412×823 screen, 4× CPU slowdown, 150 ms round trips, 1.6 Mbps down).
// A CLS under 0.1 is the "good" threshold of the Web Vitals definition (web.dev/articles/cls).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowser, signIn } from './support/browser';

type Browser = Awaited<ReturnType<typeof openBrowser>>;

describe('the Pantry loading on a phone', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await openBrowser();
    await browser.page.setViewportSize({ width: 1280, height: 800 });
    await signIn(browser.page, 'learner@cedarhollow.example', 'demo-learner-pass');
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('shifts its layout by less than 0.1 (cumulative layout shift)', async () => {
    const { page, context } = browser;
    await page.setViewportSize({ width: 412, height: 823 });
    const cdp = await context.newCDPSession(page);
    await cdp.send('Network.enable');
    await cdp.send('Network.setCacheDisabled', { cacheDisabled: true });
    await cdp.send('Network.emulateNetworkConditions', {
      offline: false,
      latency: 150,
      downloadThroughput: (1.6 * 1_000_000) / 8,
      uploadThroughput: (750 * 1_000) / 8,
    });
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });
    // Collects every layout shift not caused by input, from the first paint on.
    await page.addInitScript(() => {
      const w = window as unknown as { __cls: number };
      w.__cls = 0;
      new PerformanceObserver((list) => {
        for (const entry of list.getEntries() as unknown as { value: number; hadRecentInput: boolean }[]) {
          if (!entry.hadRecentInput) w.__cls += entry.value;
        }
      }).observe({ type: 'layout-shift', buffered: true });
    });
    const figures: number[] = [];
    for (let run = 0; run < 3; run++) {
      await page.goto('/pantry', { waitUntil: 'load', timeout: 120_000 });
      await page.getByTestId('shelf-pickling-and-canning').waitFor({ timeout: 120_000 });
      // Let late content (fonts, the header's session, the program badge) settle.
      await page.waitForLoadState('networkidle', { timeout: 60_000 }).catch(() => undefined);
      await page.waitForTimeout(1_500);
      figures.push(await page.evaluate(() => (window as unknown as { __cls: number }).__cls));
    }
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 1 });
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });
    console.log(`[pantry CLS] 412×823, 4× CPU, 150 ms RTT, 1.6 Mbps: ${figures.map((f) => f.toFixed(3)).join(', ')}`);
    expect(figures).toHaveLength(3);
    for (const f of figures) expect(f).toBeLessThan(0.1);
  }, 600_000);
});

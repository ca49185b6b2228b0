import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowser, seriousViolations, signIn } from './support/browser';

// The demo learner (active enrollment in the flagship) submits a practical with two photos and a
// process time too short for her altitude; the demo instructor approves it at the Tasting table.
describe('practical batch from the learner to the Tasting table', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  let folder: string;
  let photos: string[];

  beforeAll(async () => {
    browser = await openBrowser();
    folder = fs.mkdtempSync(path.join(os.tmpdir(), 'brinewright-e2e-photos-'));
    photos = [];
    for (const [i, colour] of ['#3f6f4f', '#b5651d'].entries()) {
      const file = path.join(folder, `jars-${i + 1}.jpg`);
      await sharp({ create: { width: 900, height: 600, channels: 3, background: colour } })
        .jpeg()
        .toFile(file);
      photos.push(file);
    }
  });
  afterAll(async () => {
    await browser?.close();
    fs.rmSync(folder, { recursive: true, force: true });
  });

  it('the learner sees the flag as she types and after submitting', async () => {
    const { page } = browser;
    await signIn(page, 'learner@cedarhollow.example', 'demo-learner-pass');
    await page.goto('/learn/pickling-and-canning/practical');
    await page.getByRole('heading', { name: 'Practical batch', level: 1 }).waitFor();
    expect(await seriousViolations(page)).toEqual([]);

    await page.getByLabel('Product').selectOption('fresh-pack-dill-pickles');
    await page.getByLabel('Pack').selectOption('raw');
    await page.getByLabel('Tested recipe followed').fill('Quick fresh-pack dill pickles');
    await page.getByLabel('Where it is published').fill('USDA Complete Guide to Home Canning (2015), Guide 6');
    await page.getByLabel('Jar size').selectOption('pint');
    await page.getByLabel('Number of jars').fill('4');
    await page.getByLabel('Headspace measured').fill('0.5');
    await page.getByLabel('Vinegar acidity').fill('5');
    await page.getByLabel('Vinegar used').fill('1420');
    await page.getByLabel('Water used').fill('1890');
    await page.getByLabel('Processing method').selectOption('boiling-water');
    // Cedar Hollow sits at 5,200 ft: USDA Guide 6 gives pints of quick dills 15 minutes there.
    await page.getByLabel('Altitude').fill('5200');
    await page.getByLabel('Minutes processed').fill('10');
    await page.getByLabel('Date put up').fill('2026-11-28');
    await page.getByLabel('Jars sealed').fill('4');
    await page.getByLabel('Jars not sealed').fill('0');

    const liveFlags = page.getByRole('region', { name: 'Numbers to double-check (as you type)' });
    await liveFlags.getByText('shorter than the published 15 min').waitFor();
    expect(await liveFlags.getByRole('listitem').count()).toBe(1);

    await page.getByLabel(/^Photos/).setInputFiles(photos);
    await expect.poll(() => page.getByText('Uploaded', { exact: true }).count(), { timeout: 20_000 }).toBe(2);
    expect(await page.getByRole('img', { name: /Photo 1: jars-1\.jpg/ }).count()).toBe(1);
    expect(await seriousViolations(page)).toEqual([]);

    await page.getByRole('button', { name: 'Send my first batch to an instructor' }).click();
    await page.getByRole('heading', { name: 'Your first batch is at the Tasting table' }).waitFor();
    const sent = page.getByRole('region', { name: 'What the instructor will double-check' });
    await sent.getByText(/Processed 10 min, shorter than the published 15 min/).waitFor();
    expect(await sent.getByText(/Processed 10 min, shorter than the published 15 min/).count()).toBe(1);

    // The page itself now shows the round waiting, with its flag, and no form.
    await page.reload();
    await page.getByTestId('practical-status').getByText('Waiting at the Tasting table').waitFor();
    expect(
      await page
        .getByTestId('round-1')
        .getByText(/shorter than the published 15 min/)
        .count(),
    ).toBe(1);
    expect(await page.getByRole('button', { name: /^Send my .* batch to an instructor$/ }).count()).toBe(0);
    expect(await seriousViolations(page)).toEqual([]);
  });

  it('the instructor finds it flagged at the Tasting table, zooms in on a photo and approves it', async () => {
    const { context, page } = browser;
    await context.clearCookies();
    await signIn(page, 'instructor@cedarhollow.example', 'demo-instructor-pass');
    await page.goto('/tasting-table');
    await page.getByRole('heading', { name: 'Tasting table', level: 1 }).waitFor();
    await page.getByLabel('To double-check').selectOption('yes');
    const row = page.getByTestId('submission-row').filter({ hasText: 'Maren Osei' });
    await row.waitFor();
    // The demo seed adds two other flagged batches waiting for review (seeders/20261201160000-demo-practicals.js).
    await expect.poll(() => page.getByTestId('count-submitted').textContent()).toBe('3');
    expect(await page.getByTestId('submission-row').filter({ hasText: 'Lena Marsh' }).count()).toBe(1);
    expect(await seriousViolations(page)).toEqual([]);

    // The filter is in the address, so the browser's back button from the submission keeps it.
    await page.waitForURL(/\/tasting-table\?flagged=yes$/);
    await row.getByRole('link', { name: 'Maren Osei' }).click();
    await page.getByRole('heading', { name: 'Maren Osei, first batch' }).waitFor();
    await page.goBack();
    await page.waitForURL(/\/tasting-table\?flagged=yes$/);
    await expect.poll(() => page.getByLabel('To double-check').inputValue()).toBe('yes');
    await row.waitFor();
    await row.getByRole('link', { name: 'Maren Osei' }).click();
    await page.getByRole('heading', { name: 'Maren Osei, first batch' }).waitFor();
    // And the page's own link back returns to the same view.
    await expect.poll(() => page.getByRole('link', { name: '← All submissions' }).getAttribute('href')).toBe('/tasting-table?flagged=yes');
    expect(
      await page
        .getByRole('region', { name: 'Numbers to double-check' })
        .getByText(/shorter than the published 15 min/)
        .count(),
    ).toBe(1);
    // The photo comes through the checked route and is shown.
    await expect
      .poll(() =>
        page
          .locator('[data-testid="photo-viewer"] img')
          .first()
          .evaluate((img: HTMLImageElement) => img.naturalWidth),
      )
      .toBe(900);
    await page.getByRole('button', { name: 'Zoom in', exact: true }).click();
    expect(await page.getByTestId('zoom-level').textContent()).toBe('150 %');
    expect(await seriousViolations(page)).toEqual([]);

    // Approving with a criterion left open is refused in the form.
    await page.getByLabel('Pass this batch').check();
    await page.getByRole('button', { name: 'Save the review' }).click();
    expect(await page.getByText('Choose met or not met.').count()).toBeGreaterThan(0);
    for (const group of await page
      .getByRole('group')
      .filter({ has: page.getByRole('radio', { name: 'Met', exact: true }) })
      .all()) {
      await group.getByRole('radio', { name: 'Met', exact: true }).check();
    }
    await page.getByLabel('Comment for the learner').fill('Clean rims and good seals. Next time process for the full 15 minutes at your altitude.');
    await page.getByRole('button', { name: 'Save the review' }).click();
    await page.getByTestId('review-summary').waitFor();
    expect(await page.getByTestId('review-summary').getByText('Passed the table').count()).toBe(1);
    expect(await page.getByRole('button', { name: 'Save the review' }).count()).toBe(0);
    expect(await seriousViolations(page)).toEqual([]);
  });

  it('the learner sees the approval and the review on her practical page', async () => {
    const { context, page } = browser;
    await context.clearCookies();
    await signIn(page, 'learner@cedarhollow.example', 'demo-learner-pass');
    await page.goto('/learn/pickling-and-canning/practical');
    await page.getByTestId('practical-status').getByText('Passed the table').waitFor();
    expect(
      await page
        .getByTestId('round-1')
        .getByText(/Clean rims and good seals/)
        .count(),
    ).toBe(1);
    expect(await seriousViolations(page)).toEqual([]);

    // The Pantry shows the same review beside the course.
    await page.goto('/pantry');
    const panel = page.getByRole('region', { name: 'Practical batches' }).getByTestId('practical-status');
    await panel.getByText('Passed the table').waitFor();
    expect(await seriousViolations(page)).toEqual([]);
  });
});

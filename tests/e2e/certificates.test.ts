import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowser, seriousViolations, signIn } from './support/browser';

describe('certificates in the browser', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;

  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('the demo coordinator issues a certificate at the desk and opens its verification page', async () => {
    const { page } = browser;
    await signIn(page, 'coordinator@cedarhollow.example', 'demo-coordinator-pass');
    await page.goto('/desk');
    await page.getByRole('heading', { name: 'Certificate desk', level: 1 }).waitFor();

    await page.getByLabel('Eligibility').selectOption('yes');
    const row = page.getByRole('row').filter({ hasText: 'Inés Alvarado' });
    await row.waitFor();
    expect(await row.getByText('All requirements met').count()).toBe(1);
    expect(await seriousViolations(page)).toEqual([]);

    // Someone not yet eligible shows what is missing.
    await page.getByLabel('Eligibility').selectOption('no');
    const maren = page.getByRole('row').filter({ hasText: 'Maren Osei' });
    await maren.waitFor();
    await maren.getByText(/missing/).click();
    expect(await maren.getByText('Missing: ').count()).toBeGreaterThan(0);

    await page.getByLabel('Eligibility').selectOption('yes');
    await row.waitFor();
    await row.getByRole('checkbox', { name: /Select Inés Alvarado/ }).check();
    await page.getByRole('button', { name: 'Issue certificates (1)' }).click();
    await page.getByText('1 certificate issued.').waitFor();

    await page.getByLabel('Eligibility').selectOption('certified');
    const issued = page.getByRole('row').filter({ hasText: 'Inés Alvarado' });
    await issued.waitFor();
    const serial = (await issued.locator('.font-mono').textContent())!.trim();
    expect(serial).toMatch(/^[2-9A-HJ-NP-Z]{4}(-[2-9A-HJ-NP-Z]{4}){3}$/);
    expect(await issued.getByText('Valid', { exact: true }).count()).toBe(1);
    expect(await seriousViolations(page)).toEqual([]);

    await issued.getByRole('link', { name: 'Verify' }).click();
    await page.waitForURL(`**/verify/${serial}`);
    await page.getByRole('heading', { name: 'This certificate is valid.' }).waitFor();
    expect(await page.getByText('Inés Alvarado').count()).toBe(1);
    expect(await page.getByText('Safe Pickling and Water-Bath Canning').count()).toBe(1);
    expect(await seriousViolations(page)).toEqual([]);

    // The serial box: a mistyped serial is caught by its check character.
    const typo = serial.slice(0, -1) + (serial.endsWith('2') ? '3' : '2');
    await page.goto('/verify');
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByLabel('Certificate serial').fill(typo.toLowerCase());
    await page.getByRole('button', { name: 'Check' }).click();
    await page.getByText('That is not a valid serial.').waitFor();

    const reports = await page.goto('/desk/reports');
    expect(reports?.status()).toBe(200);
    await page.getByRole('heading', { name: 'Reports', level: 1 }).waitFor();
    expect(await page.getByRole('table', { name: /Certificates issued and revoked per month/ }).count()).toBe(1);
    expect(await seriousViolations(page)).toEqual([]);
  });

  it('a learner near expiry sees the certificate and the refresher offer in the Pantry', async () => {
    const { page } = browser;
    await page.context().clearCookies();
    await signIn(page, 'wren@cedarhollow.example', 'demo-wren-pass');
    await page.goto('/pantry');
    await page.getByRole('heading', { name: 'Your certificates' }).waitFor();
    const certificates = page.getByRole('region', { name: 'Your certificates' });
    expect(await certificates.getByText('XJC3-GMFM-3AEY-FWPY', { exact: true }).count()).toBe(1);
    expect(await certificates.getByRole('link', { name: 'See the refresher course' }).count()).toBe(1);
    const download = await page.request.get('/api/certificates/XJC3-GMFM-3AEY-FWPY/pdf');
    expect(download.status()).toBe(200);
    expect(download.headers()['content-type']).toBe('application/pdf');
    expect(await seriousViolations(page)).toEqual([]);
  });
});

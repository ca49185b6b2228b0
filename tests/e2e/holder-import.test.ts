import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, openBrowser, seriousViolations, signIn } from './support/browser';

describe('importing certificate holders in the browser', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  const stamp = Date.now();
  const file = path.join(os.tmpdir(), `brinewright-e2e-holders-${process.pid}.csv`);

  beforeAll(async () => {
    browser = await openBrowser();
    fs.writeFileSync(
      file,
      [
        'name,email,course,certificate_date,end_date,old_serial',
        `Lark Emberly,lark-${stamp}@county.example,pickling-and-canning,2024-04-12,2027-04-12,OLD-${stamp}`,
        `Lark Emberly,lark-${stamp}@county.example,pickling-and-canning,2024-04-12,2027-04-12,OLD-${stamp}`,
        `Nope Course,nope-${stamp}@county.example,canning-at-sea,2024-04-12,2027-04-12,`,
      ].join('\n'),
    );
  });
  afterAll(async () => {
    await browser?.close();
    fs.rmSync(file, { force: true });
  });

  it('the coordinator previews a file line by line, corrects it, imports it, and the old serial verifies', async () => {
    const { page } = browser;
    await signIn(page, 'coordinator@cedarhollow.example', 'demo-coordinator-pass');
    await page.goto('/desk/import');
    await page.getByLabel('CSV file of certificate holders').setInputFiles(file);
    await page.getByRole('button', { name: 'Preview the import' }).click();
    await page.getByRole('heading', { name: 'Preview: 1 to create, 1 skipped, 1 refused' }).waitFor();
    expect(await page.getByText('duplicate of line 2 (same e-mail and course)').isVisible()).toBe(true);
    expect(await page.getByText(/course: no course "canning-at-sea"/).isVisible()).toBe(true);
    expect(await page.getByRole('button', { name: /^Import/ }).count()).toBe(0);
    expect(await seriousViolations(page)).toEqual([]);

    fs.writeFileSync(file, fs.readFileSync(file, 'utf8').split('\n').slice(0, 3).join('\n'));
    await page.getByLabel('CSV file of certificate holders').setInputFiles(file);
    await page.getByRole('button', { name: 'Preview the import' }).click();
    await page.getByRole('heading', { name: 'Preview: 1 to create, 1 skipped, 0 refused' }).waitFor();
    await page.getByRole('button', { name: 'Import 1 certificate' }).click();
    await page.getByText('Imported 1 certificate(s); 1 line(s) skipped as duplicates.').waitFor();

    const check = await fetch(`${baseUrl()}/api/certificates/OLD-${stamp}`, { headers: { 'x-forwarded-for': `203.0.113.${stamp % 200}` } });
    expect(check.status).toBe(200);
    expect(await check.json()).toMatchObject({ found: true, state: 'valid', learnerName: 'Lark Emberly' });
  });
});

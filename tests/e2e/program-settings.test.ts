import os from 'node:os';
import path from 'node:path';
import fs from 'node:fs';
import sharp from 'sharp';
import { QueryTypes, type Sequelize } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createSequelize } from '../../lib/db';
import { baseUrl, openBrowser, seriousViolations, signIn } from './support/browser';

describe('the program settings page', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  const logoFile = path.join(os.tmpdir(), `brinewright-e2e-logo-${process.pid}.png`);

  // The demo program as the seed made it, put back afterwards for the browser files that follow on this app.
  let sequelize: Sequelize;
  let seeded: Record<string, unknown>[] = [];

  beforeAll(async () => {
    sequelize = createSequelize(process.env.E2E_DATABASE_URL!, { poolMax: 1 });
    seeded = await sequelize.query('SELECT * FROM program_settings', { type: QueryTypes.SELECT });
    browser = await openBrowser();
    await sharp({ create: { width: 600, height: 300, channels: 4, background: '#b4572b' } })
      .png()
      .toFile(logoFile);
  });
  afterAll(async () => {
    await browser?.close();
    fs.rmSync(logoFile, { force: true });
    await sequelize.transaction(async (transaction) => {
      await sequelize.query('DELETE FROM program_settings', { transaction });
      if (seeded.length) await sequelize.getQueryInterface().bulkInsert('program_settings', seeded, { transaction });
    });
    await sequelize.close();
  });

  it('the admin sees the demo program, changes it with a logo, and the header, the logo route and the verification page follow', async () => {
    const { page } = browser;
    await signIn(page, 'admin@cedarhollow.example', 'demo-admin-pass');
    await page.goto('/admin/program');
    await expect.poll(() => page.getByLabel('Short name').inputValue()).toBe('Cedar Hollow Preserving');
    expect(await page.getByTestId('program-badge').textContent()).toContain('Cedar Hollow Preserving');
    expect(await seriousViolations(page)).toEqual([]);

    // The server refuses a bad field next to it, and nothing is saved (the browser passes any phone text).
    await page.getByLabel('Contact phone').fill('call the office');
    await page.getByRole('button', { name: 'Save program settings' }).click();
    await page.getByText('Use digits, spaces and + ( ) - . only.').waitFor();
    await page.getByLabel('Contact phone').fill('(555) 010-4471');

    await page.getByLabel('Short name').fill('Cedar Hollow Canning');
    await page.getByLabel('Contact e-mail').fill('canning@cedarhollow.example');
    await page.getByLabel('Default time zone').selectOption('America/Boise');
    await page.getByLabel('Logo').setInputFiles(logoFile);
    await page.getByRole('button', { name: 'Save program settings' }).click();
    await page.getByText('Program settings saved.').waitFor();

    await page.reload();
    await page.getByTestId('program-badge').getByText('Cedar Hollow Canning').waitFor();
    expect(await page.getByRole('img', { name: 'Current logo' }).isVisible()).toBe(true);
    expect(await page.getByLabel('Default time zone').inputValue()).toBe('America/Boise');

    const logo = await fetch(`${baseUrl()}/api/program/logo`);
    const meta = await sharp(Buffer.from(await logo.arrayBuffer())).metadata();
    expect({ type: logo.headers.get('content-type'), width: meta.width, height: meta.height }).toEqual({ type: 'image/png', width: 256, height: 128 });

    await page.goto('/verify/AAAA-AAAA-AAAA-AAAA');
    expect(await page.getByTestId('program-contact').textContent()).toContain('canning@cedarhollow.example');
  });

  it('serves robots.txt and a web app manifest whose icons exist', async () => {
    const robots = await fetch(`${baseUrl()}/robots.txt`);
    expect(robots.status).toBe(200);
    expect(await robots.text()).toContain('Disallow: /admin/');
    const manifest = (await (await fetch(`${baseUrl()}/manifest.webmanifest`)).json()) as { icons: { src: string; sizes: string }[] };
    for (const icon of manifest.icons) expect((await fetch(`${baseUrl()}${icon.src}`)).status, icon.src).toBe(200);
    const big = await fetch(`${baseUrl()}/icons/icon-512.png`);
    expect((await sharp(Buffer.from(await big.arrayBuffer())).metadata()).width).toBe(512);
  });
});

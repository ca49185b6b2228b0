import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createRequire } from 'node:module';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

const AXE_SOURCE = fs.readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

export const baseUrl = () => {
  const url = process.env.E2E_BASE_URL;
  if (!url) throw new Error('E2E_BASE_URL is not set: the e2e global setup did not run');
  return url;
};

/** A fresh headless Debian Chromium with an empty profile (relative addresses go to `base`, the e2e app by default). */
export async function openBrowser(base: string = baseUrl()): Promise<{ context: BrowserContext; page: Page; close: () => Promise<void> }> {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'brinewright-e2e-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    baseURL: base,
  });
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    close: async () => {
      await context.close();
      fs.rmSync(profile, { recursive: true, force: true });
    },
  };
}

export type AxeViolation = { id: string; impact: string | null; help: string; nodes: { target: string[] }[] };

/** Runs axe-core in the page and returns the serious and critical violations. */
export async function seriousViolations(page: Page): Promise<AxeViolation[]> {
  // After a client-side navigation Next sets the new document title once the page's metadata has
  // streamed in, which can be a moment after its content shows. Wait for a title (at most 5 s);
  // a page without one is still reported by axe below.
  await page.waitForFunction(() => document.title.trim() !== '', undefined, { timeout: 5_000 }).catch(() => undefined);
  await page.addScriptTag({ content: AXE_SOURCE });
  const violations = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document, opts: object) => Promise<{ violations: AxeViolation[] }> } }).axe;
    const result = await axe.run(document, { resultTypes: ['violations'] });
    return result.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.map((n) => ({ target: n.target })) }));
  });
  return violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
}

/** Signs in through the form as a person would. */
export async function signIn(page: Page, email: string, password: string) {
  await page.goto('/signin');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('signed-in-as').waitFor();
}

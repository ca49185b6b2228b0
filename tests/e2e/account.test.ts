import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowser, seriousViolations, signIn } from './support/browser';
import { messageTo } from './support/mailbox';

describe('accounts that recover, in the browser', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  const email = `juniper-${Date.now()}@test.example`;

  beforeAll(async () => {
    browser = await openBrowser();
    const { page } = browser;
    await page.goto('/register');
    await page.getByLabel('Your name').fill('Juniper Vale');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('vinegar at five percent');
    await page.getByRole('button', { name: 'Create my account' }).click();
    await page.waitForURL('**/pantry');
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('the account page changes the name and the password, sends the confirmation again, and signs out everywhere', async () => {
    const { page } = browser;
    await page.getByRole('link', { name: 'Account' }).click();
    await page.waitForURL('**/account');
    await page.getByText(/not confirmed yet/).waitFor();
    expect(await seriousViolations(page)).toEqual([]);

    await page.getByRole('button', { name: 'Send the confirmation e-mail again' }).click();
    await page.getByText(`We have sent the confirmation e-mail again to ${email}.`).waitFor();
    expect((await messageTo(email, /^Confirm your e-mail address for Brinewright$/)).text).toContain('/confirm-email?token=');

    await page.getByLabel('Name on certificates').fill('Juniper A. Vale');
    await page.getByRole('button', { name: 'Save my name' }).click();
    await page.getByText('Your name is saved.').waitFor();

    await page.getByLabel('Present password', { exact: true }).fill('vinegar at five percent');
    await page.getByLabel('New password').fill('brine by weight not volume');
    await page.getByRole('button', { name: 'Change my password' }).click();
    await page.getByText('Your password is changed, and every other session is signed out.').waitFor();
    // This browser was signed in again with the new password.
    await page.reload();
    await page.getByTestId('signed-in-as').waitFor();
    expect(await page.getByTestId('signed-in-as').textContent()).toContain('Juniper A. Vale');
    await messageTo(email, /^Your Brinewright password was changed$/);

    await page.getByRole('button', { name: 'Sign out everywhere' }).click();
    await page.waitForURL('**/signin**');
    const response = await page.goto('/account');
    expect(page.url()).toContain('/signin?callbackUrl=%2Faccount');
    expect(response?.status()).toBe(200);
  });

  it('resets a forgotten password through the e-mailed link, once', async () => {
    const { page } = browser;
    await page.goto('/signin');
    await page.getByRole('link', { name: 'Forgot your password?' }).click();
    await page.waitForURL('**/forgot-password');
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByLabel('E-mail').fill(email);
    await page.getByRole('button', { name: 'Send me a link' }).click();
    await page.getByText(/If an account uses that address, we have sent it a link/).waitFor();

    const message = await messageTo(email, /^Set a new Brinewright password$/);
    const link = /(http:\/\/\S+\/reset-password\?token=\S+)/.exec(message.text)![1];
    await page.goto(link);
    await page.getByRole('heading', { name: 'Choose a new password' }).waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByLabel('New password').fill('short');
    await page.getByRole('button', { name: 'Set my new password' }).click();
    await page.getByText('Use at least 10 characters for your password.').waitFor();
    await page.getByLabel('New password').fill('a jar of pickled beets');
    await page.getByRole('button', { name: 'Set my new password' }).click();
    await page.getByText('Your password is changed. Sign in with the new one.').waitFor();

    await signIn(page, email, 'a jar of pickled beets');
    expect(await page.getByTestId('signed-in-as').textContent()).toContain('Juniper A. Vale');

    // The same link a second time says so, and offers a new one.
    await page.goto(link);
    await page.getByRole('heading', { name: 'This link has already been used' }).waitFor();
    expect(await page.getByRole('link', { name: 'Ask for a new link' }).getAttribute('href')).toBe('/forgot-password');
  });
});

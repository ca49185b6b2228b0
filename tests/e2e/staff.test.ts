import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowser, seriousViolations, signIn } from './support/browser';
import { messageTo } from './support/mailbox';

describe('staff with sets of roles', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;

  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('the demo instructor, also a certified volunteer, opens the Pantry with a certificate to renew, and the Tasting table', async () => {
    const { page } = browser;
    await signIn(page, 'instructor@cedarhollow.example', 'demo-instructor-pass');
    expect(await page.getByTestId('signed-in-as').textContent()).toContain('Instructor and learner');
    const menu = page.getByRole('navigation', { name: 'Your pages' });
    await menu.getByRole('link', { name: 'Pantry' }).click();
    await page.waitForURL('**/pantry');
    await page.getByText('Your certificate expires soon.').waitFor();
    await page.getByRole('link', { name: 'See the refresher course' }).waitFor();
    expect(await page.getByText('R7KD-M3QW-HT2C-9PXQ').count()).toBeGreaterThan(0);
    expect(await seriousViolations(page)).toEqual([]);
    await menu.getByRole('link', { name: 'Tasting table' }).click();
    await page.waitForURL('**/tasting-table');
    await page.getByRole('heading', { level: 1 }).waitFor();
    expect(await menu.getByRole('link', { name: 'Certificate desk' }).count()).toBe(0);
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL((url) => url.pathname === '/');
  });

  it('an admin invites a staff member; the invitee opens the e-mailed link, chooses a name and password, and arrives signed in with the roles', async () => {
    const { page } = browser;
    const email = `juno.staff-${Date.now()}@test.example`;
    await signIn(page, 'admin@cedarhollow.example', 'demo-admin-pass');
    await page.goto('/admin/users');
    await page.getByRole('link', { name: 'Invite staff by e-mail' }).click();
    await page.waitForURL('**/admin/invitations');
    await page.getByLabel('E-mail').fill(email);
    // Instructor is ticked by default; add learner.
    await page.getByRole('checkbox', { name: 'Learner' }).check();
    await page.getByRole('button', { name: 'Send the invitation' }).click();
    await page.getByText(`Invitation sent to ${email}.`).waitFor();
    await page.getByRole('cell', { name: email }).waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL((url) => url.pathname === '/');

    const message = await messageTo(email, /invited/);
    expect(message.text).toContain('Dale Okafor invites you');
    const link = message.text.match(/https?:\/\/\S+\/invitation\?token=[A-Za-z0-9_-]{43}/)?.[0];
    expect(link).toBeTruthy();
    await page.goto(new URL(link!).pathname + new URL(link!).search);
    await page.getByText('instructor and learner').first().waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByLabel('Your name').fill('Juno Staff');
    await page.getByLabel('Password').fill('brine at five percent');
    await page.getByRole('button', { name: 'Create my account' }).click();
    await page.waitForURL('**/tasting-table');
    expect(await page.getByTestId('signed-in-as').textContent()).toContain('Juno Staff · Instructor and learner');

    // The link worked once.
    await page.goto(new URL(link!).pathname + new URL(link!).search);
    await page.getByRole('heading', { name: 'This invitation was already used' }).waitFor();
    await page.getByRole('button', { name: 'Sign out' }).click();
  });
});

describe('the audit log viewer', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;

  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('a coordinator filters by person, kind of action and date; the filters stay in the address and survive a reload', async () => {
    const { page } = browser;
    // Something to find: the admin changes a demo learner's roles and back (two entries by Dale Okafor).
    await signIn(page, 'admin@cedarhollow.example', 'demo-admin-pass');
    await page.goto('/admin/users?q=hollis');
    const learner = page.getByRole('checkbox', { name: 'Learner' });
    await page.getByRole('checkbox', { name: 'Instructor' }).check();
    await page.getByRole('button', { name: 'Save roles' }).click();
    await page.getByText('Roles saved.').waitFor();
    expect(await learner.isChecked()).toBe(true);
    await page.getByRole('checkbox', { name: 'Instructor' }).uncheck();
    await page.getByRole('button', { name: 'Save roles' }).click();
    await page.getByText('Roles saved.').waitFor();
    await page.getByRole('cell', { name: 'Learner', exact: true }).waitFor();
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL((url) => url.pathname === '/');

    await signIn(page, 'coordinator@cedarhollow.example', 'demo-coordinator-pass');
    await page.goto('/desk/audit');
    await page.getByRole('heading', { name: 'Audit log', level: 1 }).waitFor();
    const filters = page.getByRole('form', { name: 'Filter the audit log' });
    await filters.getByLabel('Person').selectOption({ label: 'Dale Okafor (admin@cedarhollow.example)' });
    await filters.getByLabel('Kind of action').selectOption({ label: 'changed the roles of an account' });
    const yesterday = new Date(Date.now() - 86_400_000).toISOString().slice(0, 10);
    const tomorrow = new Date(Date.now() + 86_400_000).toISOString().slice(0, 10);
    await filters.getByLabel('From', { exact: true }).fill(yesterday);
    await filters.getByLabel('To', { exact: true }).fill(tomorrow);
    await filters.getByRole('button', { name: 'Show' }).click();
    await page.waitForURL((url) => url.pathname === '/desk/audit' && url.searchParams.get('action') === 'user.roles_changed');
    const url = new URL(page.url());
    expect({ from: url.searchParams.get('from'), to: url.searchParams.get('to'), person: Boolean(url.searchParams.get('person')) }).toEqual({
      from: yesterday,
      to: tomorrow,
      person: true,
    });
    const rows = page.getByRole('row').filter({ hasText: 'changed the roles of an account' });
    expect(await rows.count()).toBeGreaterThan(0);
    expect(await page.getByRole('row').filter({ hasText: 'Dale Okafor' }).count()).toBe(await rows.count());
    expect(await page.getByRole('cell', { name: 'issued a certificate' }).count()).toBe(0);
    expect(await seriousViolations(page)).toEqual([]);

    // The address alone gives the same answer (read on the server), and a day with nothing shows nothing.
    await page.reload();
    expect(await page.getByRole('row').filter({ hasText: 'changed the roles of an account' }).count()).toBe(await rows.count());
    await page.goto(`/desk/audit?action=user.roles_changed&from=2020-01-01&to=2020-01-02`);
    await page.getByText('No entry matches these filters.').waitFor();
  });
});

import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowser, seriousViolations } from './support/browser';
import { mailbox, messageTo } from './support/mailbox';

describe('enrolling and paying in the browser', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;

  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('a new learner enrolls in a workshop, pays with the test card, lands on the Pantry with the course, and has the e-mails', async () => {
    const { page } = browser;
    const email = `hazel-${Date.now()}@test.example`;
    await page.goto('/register');
    await page.getByLabel('Your name').fill('Hazel Quill');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('vinegar at five percent');
    await page.getByRole('button', { name: 'Create my account' }).click();
    await page.waitForURL('**/pantry');

    // An unconfirmed address cannot enroll: the refusal says how, and offers the e-mail again.
    await page.goto('/courses/pickling-and-canning');
    const workshops = page.getByRole('region', { name: 'Upcoming workshops' });
    const first = workshops.getByRole('listitem').first();
    await first.getByRole('button', { name: 'Enroll in this workshop' }).click();
    await first.getByText(/confirm your e-mail address first/i).waitFor();
    await first.getByRole('button', { name: 'Send the confirmation e-mail again' }).waitFor();

    // The fake mailbox has the welcome message with its confirmation link.
    const welcome = await messageTo(email, /^Welcome to Brinewright/);
    expect(welcome.html).toContain('Confirm my e-mail address');
    const link = /(http:\/\/\S+\/confirm-email\?token=\S+)/.exec(welcome.text)![1];
    await page.goto(link);
    await page.getByRole('heading', { name: 'Your e-mail address is confirmed' }).waitFor();
    expect(await seriousViolations(page)).toEqual([]);

    await page.goto('/courses/pickling-and-canning');
    await first.getByRole('button', { name: 'Enroll in this workshop' }).waitFor();
    const seatsBefore = await first.getByText(/seats left/).textContent();
    expect(seatsBefore).toMatch(/^\d+ of \d+ seats left$/);
    expect(await first.getByText('Cedar Hollow Grange Hall, 14 Mill Road, Cedar Hollow', { exact: true }).count()).toBe(1);
    expect(await seriousViolations(page)).toEqual([]);

    await first.getByRole('button', { name: 'Enroll in this workshop' }).click();
    await page.waitForURL(/\/pay\/cs_test_/);
    await page.getByRole('heading', { name: 'Practice payment for Safe Pickling and Water-Bath Canning' }).waitFor();
    expect(await page.getByText('no money moves and no card is charged').count()).toBe(1);
    expect(await page.getByText('$45.00').first().textContent()).toBe('$45.00');
    expect(await seriousViolations(page)).toEqual([]);

    // The practice card that is turned down first: the page says so and stays open.
    await page.getByLabel('Card number').fill('4600 4600 9090 9096');
    await page.getByLabel('Expiry (MM/YY)').fill('12/34');
    await page.getByLabel('Security code').fill('123');
    await page.getByLabel('Name on card').fill('Hazel Quill');
    await page.getByRole('button', { name: 'Pay the course fee ($45.00)' }).click();
    await page.getByRole('alert').filter({ hasText: 'The card’s bank turned this payment down' }).waitFor();
    expect(await seriousViolations(page)).toEqual([]);

    // Webhooks are held back for a moment, so the success page is seen waiting for the payment.
    const payments = process.env.E2E_PAYMENTS_URL!;
    await fetch(`${payments}/_fake/webhooks/pause`, { method: 'POST' });
    try {
      await page.getByLabel('Card number').fill('4600 4600 4600 4604');
      await page.getByRole('button', { name: 'Pay the course fee ($45.00)' }).click();
      await page.waitForURL(/\/checkout\/success\?session_id=cs_test_/);
      await page.getByRole('heading', { name: 'Confirming your payment…' }).waitFor();
      expect(await seriousViolations(page)).toEqual([]);
    } finally {
      await fetch(`${payments}/_fake/webhooks/resume`, { method: 'POST' });
    }
    await page.getByRole('heading', { name: 'You are enrolled' }).waitFor({ timeout: 45_000 });

    await page.waitForURL('**/pantry', { timeout: 45_000 });
    await page.getByText('Safe Pickling and Water-Bath Canning').first().waitFor();
    expect(await seriousViolations(page)).toEqual([]);

    // The course page now shows the learner's place and one seat fewer.
    await page.goto('/courses/pickling-and-canning');
    await workshops.getByText('You are enrolled').first().waitFor();
    const seatsAfter = await workshops
      .getByRole('listitem')
      .first()
      .getByText(/seats left|Full/)
      .textContent();
    expect(Number(seatsAfter!.split(' ')[0])).toBe(Number(seatsBefore!.split(' ')[0]) - 1);

    // The fake mailbox has the receipt.
    const receipt = await messageTo(email, /^You are enrolled: Safe Pickling and Water-Bath Canning$/);
    expect(receipt.text).toContain('Amount paid: $45.00');
    expect(receipt.text).toContain('Place: Cedar Hollow Grange Hall, 14 Mill Road, Cedar Hollow');

    await page.goto(process.env.E2E_MAILBOX_URL!);
    await page.getByRole('link', { name: 'You are enrolled: Safe Pickling and Water-Bath Canning' }).first().waitFor();
    expect(await seriousViolations(page)).toEqual([]);
  });

  it('the coordinator refunds the payment at the desk; the learner is e-mailed', async () => {
    // The coordinator works in a browser of their own.
    const desk = await openBrowser();
    const { page } = desk;
    await page.goto('/signin');
    await page.getByLabel('E-mail').fill('coordinator@cedarhollow.example');
    await page.getByLabel('Password').fill('demo-coordinator-pass');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByTestId('signed-in-as').waitFor();

    await page.goto('/desk/payments');
    const row = page.getByRole('row').filter({ hasText: 'Hazel Quill' });
    await row.getByText('Paid', { exact: true }).waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await row.getByRole('button', { name: 'Refund Hazel Quill' }).click();
    const dialog = page.getByRole('dialog', { name: /Refund \$45\.00 to Hazel Quill/ });
    await dialog.getByLabel('Reason (kept in the audit log)').fill('Cannot attend');
    await dialog.getByRole('button', { name: 'Refund $45.00' }).click();
    await page.getByRole('row').filter({ hasText: 'Hazel Quill' }).getByText('Paid, then refunded', { exact: true }).waitFor();
    const to = (await mailbox()).find((m) => m.subject.startsWith('Welcome') && m.text.includes('Hazel Quill'))!.to[0];
    const refund = await messageTo(to, /^Refund issued: Safe Pickling and Water-Bath Canning$/);
    expect(refund.text).toContain('Refunded: $45.00');

    await page.goto('/desk/workshops');
    await page.getByRole('heading', { name: 'Workshops' }).waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await page.goto('/desk/waivers');
    await page.getByText('CEDAR-VOLUNTEER').waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await desk.close();
  });
});

import { describe, expect, it } from 'vitest';
import { CARDS, luhnValid, spaced } from '@/fakes/payments/cards';
import { checkoutPage } from '@/fakes/payments/page';

describe('practice card numbers', () => {
  it('checks digits the Luhn way', () => {
    // The worked example of the Luhn algorithm (ISO/IEC 7812-1 annex B; the number from memory): 7992739871 takes check digit 3.
    expect(luhnValid('79927398713')).toBe(true);
    expect(luhnValid('79927398710')).toBe(false);
    // One mistyped digit always fails (the property the check digit exists for).
    expect(luhnValid(CARDS.pays.slice(0, -2) + '1' + CARDS.pays.slice(-1))).toBe(false);
  });

  it('are both Luhn-valid, different, and printed in groups of four', () => {
    expect(luhnValid(CARDS.pays)).toBe(true);
    expect(luhnValid(CARDS.declined)).toBe(true);
    expect(CARDS.pays).not.toBe(CARDS.declined);
    expect(spaced(CARDS.pays)).toBe('4600 4600 4600 4604');
    expect(spaced(CARDS.declined)).toBe('4600 4600 9090 9096');
  });

  it('the page is headed as a practice payment where no money moves, with both numbers', () => {
    const html = checkoutPage({
      id: 'cs_test_1',
      amount_total: 4500,
      currency: 'usd',
      customer_email: 'hazel@test.example',
      cancel_url: 'http://localhost/courses/x',
      status: 'open',
      line_items_name: 'Safe Pickling',
    });
    expect(html).toContain('<h1>Practice payment for Safe Pickling</h1>');
    expect(html).toContain('no money moves');
    expect(html).toContain('4600 4600 4600 4604');
    expect(html).toContain('4600 4600 9090 9096');
    expect(html).toContain('<button type="submit">Pay the course fee ($45.00)</button>');
  });
});

import { describe, expect, it } from 'vitest';
import { decodeForm } from '../../fakes/payments/form';

describe("the fake payment server's form decoding", () => {
  it('rebuilds the nested objects and arrays the stripe SDK encodes (body seen from stripe 23.1 checkout.sessions.create)', () => {
    const body =
      'mode=payment&line_items[0][quantity]=1&line_items[0][price_data][currency]=usd&line_items[0][price_data][unit_amount]=4500&line_items[0][price_data][product_data][name]=X&success_url=http%3A%2F%2Fa%2Fs%3Fsession_id%3D%7BCHECKOUT_SESSION_ID%7D&metadata[enrollmentId]=5';
    expect(decodeForm(body)).toEqual({
      mode: 'payment',
      line_items: [{ quantity: '1', price_data: { currency: 'usd', unit_amount: '4500', product_data: { name: 'X' } } }],
      success_url: 'http://a/s?session_id={CHECKOUT_SESSION_ID}',
      metadata: { enrollmentId: '5' },
    });
  });
  it('reads an empty body as no parameters', () => {
    expect(decodeForm('')).toEqual({});
  });
});

import { describe, expect, it } from 'vitest';
import { checkConfirmationToken, confirmationToken } from './confirmation';

const secret = 'unit-test-secret-0123456789';
const later = new Date(Date.now() + 3_600_000);
const lookup = (email: string | null) => async () => email;

describe('e-mail confirmation token', () => {
  it('accepts its own token for the same address', async () => {
    const token = confirmationToken({ userId: 7, email: 'Ana@Example.org', secret, expiresAt: later });
    expect(await checkConfirmationToken(token, secret, lookup('ana@example.org'))).toEqual({ ok: true, userId: 7 });
  });
  it('refuses a token after the address changed, with another secret, or tampered', async () => {
    const token = confirmationToken({ userId: 7, email: 'ana@example.org', secret, expiresAt: later });
    expect(await checkConfirmationToken(token, secret, lookup('other@example.org'))).toEqual({ ok: false, reason: 'mismatch' });
    expect(await checkConfirmationToken(token, 'another-secret-0123456789', lookup('ana@example.org'))).toEqual({ ok: false, reason: 'mismatch' });
    expect(await checkConfirmationToken(token.replace(/^7\./, '8.'), secret, lookup('ana@example.org'))).toEqual({ ok: false, reason: 'mismatch' });
    expect(await checkConfirmationToken('not-a-token', secret, lookup('ana@example.org'))).toEqual({ ok: false, reason: 'malformed' });
  });
  it('refuses an expired token', async () => {
    const token = confirmationToken({ userId: 7, email: 'ana@example.org', secret, expiresAt: new Date(Date.now() - 1000) });
    expect(await checkConfirmationToken(token, secret, lookup('ana@example.org'))).toEqual({ ok: false, reason: 'expired' });
  });
});

import { describe, expect, it } from 'vitest';
import { sessionIsLive, type AccountState } from './sessions';

const account: AccountState = { roles: ['learner'], sessionVersion: 2, deactivatedAt: null };
const now = 1_800_000_000;
const options = { nowSeconds: now, maxAgeDays: 7 };

describe('sessionIsLive', () => {
  it('accepts a token of the current version, signed in within the lifetime', () => {
    expect(sessionIsLive({ sessionVersion: 2, signedInAt: now - 60 }, account, options)).toBe(true);
    expect(sessionIsLive({ sessionVersion: 2, signedInAt: now - 7 * 86400 }, account, options)).toBe(true);
  });
  it('refuses a token from before the version was raised (password reset, sign out everywhere)', () => {
    expect(sessionIsLive({ sessionVersion: 1, signedInAt: now - 60 }, account, options)).toBe(false);
  });
  it('refuses a deactivated or missing account', () => {
    expect(sessionIsLive({ sessionVersion: 2, signedInAt: now }, { ...account, deactivatedAt: new Date() }, options)).toBe(false);
    expect(sessionIsLive({ sessionVersion: 2, signedInAt: now }, null, options)).toBe(false);
  });
  it('refuses a sign-in older than the absolute lifetime, however fresh the cookie', () => {
    expect(sessionIsLive({ sessionVersion: 2, signedInAt: now - 7 * 86400 - 1 }, account, options)).toBe(false);
  });
});

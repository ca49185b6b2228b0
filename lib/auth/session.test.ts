import { encode } from 'next-auth/jwt';
import { describe, expect, it, vi } from 'vitest';
import { sessionCookieName, sessionTokenFrom, userFromCookies, usesSecureCookies } from './session';

const secret = 'unit-test-secret-0123456789abcdef';
const claims = { uid: 42, roles: ['learner' as const, 'instructor' as const], email: 'ada@cedarhollow.example', name: 'Ada Fenwick', sub: '42' };

describe('session cookie name', () => {
  it('is prefixed with __Secure- exactly when the app is served over https (next-auth default cookies)', () => {
    expect(usesSecureCookies('https://brinewright.example')).toBe(true);
    expect(usesSecureCookies('http://localhost:3000')).toBe(false);
    expect(usesSecureCookies(undefined)).toBe(false);
    expect(sessionCookieName(true)).toBe('__Secure-next-auth.session-token');
    expect(sessionCookieName(false)).toBe('next-auth.session-token');
  });

  it('joins chunked cookies in the order of their numeric suffix and ignores other cookies', () => {
    const cookies = [
      { name: 'next-auth.session-token.1', value: 'BBB' },
      { name: 'next-auth.csrf-token', value: 'csrf' },
      { name: 'next-auth.session-token.0', value: 'AAA' },
      { name: 'next-auth.session-token.10', value: 'DDD' },
      { name: 'next-auth.session-token.2', value: 'CCC' },
    ];
    expect(sessionTokenFrom(cookies, false)).toBe('AAABBBCCCDDD');
    expect(sessionTokenFrom(cookies, true)).toBe('');
  });
});

describe('userFromCookies', () => {
  it('returns the user a token made by next-auth encode names, with the roles from the token', async () => {
    const token = await encode({ token: claims, secret, maxAge: 60 });
    const user = await userFromCookies([{ name: 'next-auth.session-token', value: token }], { secret, secure: false });
    expect(user).toMatchObject({ id: 42, roles: ['learner', 'instructor'], email: 'ada@cedarhollow.example', name: 'Ada Fenwick', sessionVersion: 0 });
    // A token without a sign-in stamp counts from when it was issued (jose's iat).
    expect(Math.abs(user!.signedInAt - Date.now() / 1000)).toBeLessThan(5);
  });

  it('reads a token written before role sets (one `role`) as that one role, for one release', async () => {
    const { roles: _roles, ...rest } = claims;
    const token = await encode({ token: { ...rest, role: 'instructor' }, secret, maxAge: 60 });
    expect(await userFromCookies([{ name: 'next-auth.session-token', value: token }], { secret, secure: false })).toMatchObject({
      id: 42,
      roles: ['instructor'],
    });
  });

  it('reads the session stamp (version and sign-in time) the jwt callback writes', async () => {
    const token = await encode({ token: { ...claims, sv: 4, sat: 1_700_000_000 }, secret, maxAge: 60 });
    const user = await userFromCookies([{ name: 'next-auth.session-token', value: token }], { secret, secure: false });
    expect(user).toMatchObject({ id: 42, sessionVersion: 4, signedInAt: 1_700_000_000 });
  });

  it('reads a token split over two cookie chunks', async () => {
    const token = await encode({ token: claims, secret, maxAge: 60 });
    const half = Math.floor(token.length / 2);
    const cookies = [
      { name: '__Secure-next-auth.session-token.1', value: token.slice(half) },
      { name: '__Secure-next-auth.session-token.0', value: token.slice(0, half) },
    ];
    expect((await userFromCookies(cookies, { secret, secure: true }))?.id).toBe(42);
    // The same cookies under the wrong name (an http app) are not a session.
    expect(await userFromCookies(cookies, { secret, secure: false })).toBeNull();
  });

  it('refuses a token encrypted with another secret, a tampered token and garbage', async () => {
    const other = await encode({ token: claims, secret: 'another-secret-0123456789abcdef', maxAge: 60 });
    expect(await userFromCookies([{ name: 'next-auth.session-token', value: other }], { secret, secure: false })).toBeNull();
    const good = await encode({ token: claims, secret, maxAge: 60 });
    const parts = good.split('.');
    parts[3] = parts[3].slice(0, -2) + (parts[3].endsWith('AA') ? 'BB' : 'AA');
    expect(await userFromCookies([{ name: 'next-auth.session-token', value: parts.join('.') }], { secret, secure: false })).toBeNull();
    expect(await userFromCookies([{ name: 'next-auth.session-token', value: 'not-a-token' }], { secret, secure: false })).toBeNull();
    expect(await userFromCookies([], { secret, secure: false })).toBeNull();
  });

  it('refuses an expired token (past exp and next-auth’s 15 s clock tolerance) but accepts one inside the tolerance', async () => {
    const expired = await encode({ token: claims, secret, maxAge: -20 });
    expect(await userFromCookies([{ name: 'next-auth.session-token', value: expired }], { secret, secure: false })).toBeNull();
    const justExpired = await encode({ token: claims, secret, maxAge: -5 });
    expect((await userFromCookies([{ name: 'next-auth.session-token', value: justExpired }], { secret, secure: false }))?.id).toBe(42);
  });

  it('refuses claims without a numeric user id or with an unknown role', async () => {
    for (const bad of [{ ...claims, uid: '42' }, { ...claims, roles: ['learner', 'superuser'] }, { uid: 42, role: 'superuser' }, { email: 'x@y.example' }]) {
      const token = await encode({ token: bad as never, secret, maxAge: 60 });
      expect(await userFromCookies([{ name: 'next-auth.session-token', value: token }], { secret, secure: false })).toBeNull();
    }
  });
});

describe('userFromCookies keeps decrypted tokens', () => {
  it('refuses a remembered token once it expires, and a remembered token under another secret', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    try {
      const start = new Date('2026-12-02T10:00:00Z');
      vi.setSystemTime(start);
      const token = await encode({ token: { ...claims, uid: 7 }, secret, maxAge: 60 });
      const cookies = [{ name: 'next-auth.session-token', value: token }];
      expect((await userFromCookies(cookies, { secret, secure: false }))?.id).toBe(7);
      // Still inside exp + 15 s tolerance: accepted from memory.
      vi.setSystemTime(new Date(start.getTime() + 70_000));
      expect((await userFromCookies(cookies, { secret, secure: false }))?.id).toBe(7);
      expect(await userFromCookies(cookies, { secret: 'another-secret-0123456789abcdef', secure: false })).toBeNull();
      // Past exp + 15 s: refused, also when asked again with the right secret.
      vi.setSystemTime(new Date(start.getTime() + 76_000));
      expect(await userFromCookies(cookies, { secret, secure: false })).toBeNull();
      expect(await userFromCookies(cookies, { secret, secure: false })).toBeNull();
    } finally {
      vi.useRealTimers();
    }
  });
});

import { describe, expect, it } from 'vitest';
import { EnvError, parseEnv } from './env';

const good = { DATABASE_URL: 'mariadb://app:pw@127.0.0.1:3307/brinewright', NEXTAUTH_SECRET: '0123456789abcdef' };

describe('parseEnv', () => {
  it('accepts a complete configuration and fills defaults', () => {
    const env = parseEnv(good);
    expect(env.DATABASE_URL).toBe(good.DATABASE_URL);
    expect(env.APP_URL).toBe('http://localhost:3000');
    expect(env.SIGNIN_MAX_PER_ACCOUNT_ADDRESS).toBe(5);
    expect(env.REGISTER_MAX_PER_ADDRESS).toBe(30);
    expect(env.SMTP_REQUIRE_TLS).toBe(true);
  });

  it('names DATABASE_URL when it is missing', () => {
    expect(() => parseEnv({ NEXTAUTH_SECRET: good.NEXTAUTH_SECRET })).toThrow(/DATABASE_URL is missing/);
  });

  it('names DATABASE_URL when it is malformed', () => {
    for (const bad of ['not a url', 'postgres://u:p@h:1/db', 'mariadb://127.0.0.1:3307/']) {
      expect(() => parseEnv({ ...good, DATABASE_URL: bad }), bad).toThrow(/DATABASE_URL is malformed/);
    }
  });

  it('names every wrong variable at once', () => {
    try {
      parseEnv({ NEXTAUTH_SECRET: 'short' });
      expect.unreachable('parseEnv should have thrown');
    } catch (error) {
      expect(error).toBeInstanceOf(EnvError);
      expect((error as Error).message).toMatch(/DATABASE_URL/);
      expect((error as Error).message).toMatch(/NEXTAUTH_SECRET is too short/);
    }
  });
});

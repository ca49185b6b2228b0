import { describe, expect, it } from 'vitest';
import { RegisterSchema } from './user';

describe('RegisterSchema', () => {
  it('normalises the e-mail address', () => {
    const parsed = RegisterSchema.parse({ name: ' Ada ', email: ' Ada@Example.ORG ', password: 'long enough pw' });
    expect(parsed).toEqual({ name: 'Ada', email: 'ada@example.org', password: 'long enough pw' });
  });
  it('refuses a password under 10 characters with a clear message', () => {
    const result = RegisterSchema.safeParse({ name: 'Ada', email: 'ada@example.org', password: '123456789' });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0].message).toBe('Use at least 10 characters for your password.');
  });
  it('refuses a malformed e-mail address', () => {
    expect(RegisterSchema.safeParse({ name: 'Ada', email: 'ada@', password: '1234567890' }).success).toBe(false);
  });
});

import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { ENV_NAMES, parseEnv } from '../../lib/env';

const example = fs.readFileSync(path.resolve(__dirname, '../../.env.example'), 'utf8');
// NAME=value lines, set or commented out (# NAME=value); quoted values as bash and dotenv read them.
const entries = [...example.matchAll(/^(#\s*)?([A-Z][A-Z0-9_]*)=(.*)$/gm)].map(([, commented, name, value]) => ({
  name,
  value: value.replace(/^"(.*)"$/, '$1'),
  set: !commented,
}));

describe('.env.example', () => {
  it('lists every variable lib/env.ts reads, and no other', () => {
    expect(entries.map((e) => e.name).sort()).toEqual([...ENV_NAMES].sort());
  });

  it('its set values pass lib/env.ts once the two required ones are given', () => {
    const values = Object.fromEntries(entries.filter((e) => e.set).map((e) => [e.name, e.value]));
    const env = parseEnv({ ...values, DATABASE_URL: 'mariadb://u:p@127.0.0.1:3307/brinewright', NEXTAUTH_SECRET: 'x'.repeat(32) });
    expect(env.STORAGE_DRIVER).toBe('disk');
    expect(env.CHECKOUT_EXPIRES_MINUTES).toBe(30);
  });
});

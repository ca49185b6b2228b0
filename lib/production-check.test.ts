import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { parseEnv } from './env';
import { DEMO_SECRETS, demoSettings, isLoopback, refuseDemoSettings } from './production-check';

// A production configuration with nothing from the repository in it.
const real = {
  NODE_ENV: 'production',
  DATABASE_URL: 'mariadb://app:pw@db.internal:3306/brinewright',
  NEXTAUTH_SECRET: 'a-real-secret-that-is-long-enough-0001',
  NEXTAUTH_URL: 'https://learn.example.org',
  APP_URL: 'https://learn.example.org',
  STRIPE_SECRET_KEY: 'sk_live_program_key',
  STRIPE_WEBHOOK_SECRET: 'whsec_program_secret',
  STRIPE_API_HOST: 'api.stripe.com',
  STRIPE_API_PORT: '443',
  STRIPE_API_PROTOCOL: 'https',
};

describe('demoSettings', () => {
  it('finds nothing in a real configuration', () => {
    expect(demoSettings(parseEnv(real))).toEqual([]);
  });

  it('names each secret equal to a value kept in the repository', () => {
    for (const [name, values] of Object.entries(DEMO_SECRETS)) {
      for (const value of values!) {
        const extra = name.startsWith('S3_')
          ? { STORAGE_DRIVER: 's3', S3_BUCKET: 'photos', S3_ACCESS_KEY_ID: 'AKIAPROGRAM', S3_SECRET_ACCESS_KEY: 'program-s3-secret' }
          : {};
        const problems = demoSettings(parseEnv({ ...real, ...extra, [name]: value }));
        expect(problems, `${name}=${value}`).toHaveLength(1);
        expect(problems[0]).toMatch(new RegExp(`^${name} is a demo or test value`));
      }
    }
  });

  it('refuses the defaults: the demo payment key and secret and the local payment fake', () => {
    const problems = demoSettings(parseEnv({ NODE_ENV: 'production', DATABASE_URL: real.DATABASE_URL, NEXTAUTH_SECRET: real.NEXTAUTH_SECRET }));
    expect(problems.map((p) => p.split(' ')[0])).toEqual(['STRIPE_SECRET_KEY', 'STRIPE_WEBHOOK_SECRET', 'STRIPE_API_HOST/STRIPE_API_PROTOCOL']);
    expect(demoSettings(parseEnv({ ...real, STRIPE_API_HOST: '127.0.0.1', STRIPE_API_PROTOCOL: 'https' }))[0]).toMatch(/local fake/);
    expect(demoSettings(parseEnv({ ...real, STRIPE_API_PROTOCOL: 'http' }))[0]).toMatch(/local fake/);
  });

  it('refuses plain http addresses except on localhost and 127.0.0.1', () => {
    expect(demoSettings(parseEnv({ ...real, NEXTAUTH_URL: 'http://learn.example.org', APP_URL: 'http://10.0.0.5:3000' }))).toEqual([
      expect.stringMatching(/^NEXTAUTH_URL is plain http on learn\.example\.org/),
      expect.stringMatching(/^APP_URL is plain http on 10\.0\.0\.5/),
    ]);
    expect(demoSettings(parseEnv({ ...real, NEXTAUTH_URL: 'http://localhost:3000', APP_URL: 'http://127.0.0.1:3000' }))).toEqual([]);
  });
});

describe('refuseDemoSettings', () => {
  const demo = parseEnv({ ...real, STRIPE_SECRET_KEY: 'sk_test_brinewright_local' });

  it('throws in production, naming the variable', () => {
    expect(() => refuseDemoSettings(demo, {}, 'The app server')).toThrow(/The app server refuses to start in production[\s\S]*- STRIPE_SECRET_KEY/);
  });

  it('lets BRINEWRIGHT_DEMO=1, next build and other environments through', () => {
    expect(() => refuseDemoSettings(demo, { BRINEWRIGHT_DEMO: '1' })).not.toThrow();
    expect(() => refuseDemoSettings(demo, { NEXT_PHASE: 'phase-production-build' })).not.toThrow();
    expect(() => refuseDemoSettings(parseEnv({ ...real, NODE_ENV: 'development', STRIPE_SECRET_KEY: 'sk_test_brinewright_local' }), {})).not.toThrow();
    // Only the exact flag: anything else still refuses.
    expect(() => refuseDemoSettings(demo, { BRINEWRIGHT_DEMO: 'true' })).toThrow();
  });
});

describe('isLoopback', () => {
  it('knows this machine by name and address', () => {
    for (const host of ['localhost', '127.0.0.1', '127.8.9.10', '::1', '[::1]']) expect(isLoopback(host), host).toBe(true);
    for (const host of ['smtp.example.org', '10.0.0.1', '128.0.0.1', 'localhost.example.org']) expect(isLoopback(host), host).toBe(false);
  });
});

describe('DEMO_SECRETS', () => {
  it('lists every payment key, webhook secret and S3 test key written in the repository', () => {
    // git grep over the tracked files: each literal that looks like one of these is a value anyone can read.
    const grep = (pattern: string) =>
      execFileSync('git', ['grep', '-hoE', pattern, '--', 'lib', 'tests', 'scripts', 'fakes', 'seeders', ':!lib/production-check.test.ts'], {
        encoding: 'utf8',
      })
        .split('\n')
        .filter(Boolean);
    const found = [
      ...grep("'(sk_test_[A-Za-z0-9_]+|whsec_[A-Za-z0-9_]+|BRINEWRIGHT[A-Z0-9]*KEY[0-9A-Z]*)'").map((s) => s.slice(1, -1)),
      // S3 secrets in tests: `const SECRET = '…'` and `secretAccessKey: '…'`.
      ...grep("(const SECRET = |secretAccessKey: )'[^']{12,}'").map((s) => s.slice(s.indexOf("'") + 1, -1)),
    ];
    const listed = new Set(Object.values(DEMO_SECRETS).flat());
    expect(found.length).toBeGreaterThan(5);
    expect([...new Set(found)].filter((value) => !listed.has(value))).toEqual([]);
  });
});

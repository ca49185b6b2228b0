import { EnvError, type Env } from './env';

// Secrets written in this repository (defaults, demo scripts, tests): anyone can read them, so a
// production server must never run with one.
export const DEMO_SECRETS: Partial<
  Record<'STRIPE_SECRET_KEY' | 'STRIPE_WEBHOOK_SECRET' | 'S3_ACCESS_KEY_ID' | 'S3_SECRET_ACCESS_KEY' | 'NEXTAUTH_SECRET', readonly string[]>
> = {
  STRIPE_SECRET_KEY: ['sk_test_brinewright_local', 'sk_test_integration_h4', 'sk_test_sweep', 'sk_test_signer', 'sk_test_fake_signer'],
  STRIPE_WEBHOOK_SECRET: ['whsec_brinewright_local_signing_secret', 'whsec_integration_test_secret_h4', 'whsec_someone_else'],
  // The demo's S3 secret is made per checkout (.data/fake-s3-secret); its key id is fixed.
  S3_ACCESS_KEY_ID: [
    'BRINEWRIGHTDEMOKEY01',
    'BRINEWRIGHTTESTKEY01',
    'BRINEWRIGHTSIGKEY001',
    'BRINEWRIGHTINTKEY001',
    'BRINEWRIGHTE2EKEY001',
    'SOMEONEELSE000000000',
  ],
  S3_SECRET_ACCESS_KEY: [
    'signature-test-secret-0123456789abcdef',
    'brinewright-test-secret-0123456789abcdef',
    'integration-s3-secret-0123456789abcdef',
    'not-the-secret-at-all-0000',
    'another-secret-entirely-000000',
  ],
  NEXTAUTH_SECRET: ['e2e-secret-0123456789abcdef', 'integration-tests-secret-0123456789', 'bench-secret-0123456789abcdef', 'not-used-by-migrations'],
};

const LOOPBACK = new Set(['localhost', '127.0.0.1', '::1', '[::1]']);

/** True for a host name that is this machine (localhost, 127.0.0.0/8, ::1). */
export function isLoopback(host: string): boolean {
  const h = host.trim().toLowerCase();
  return LOOPBACK.has(h) || /^127\.\d{1,3}\.\d{1,3}\.\d{1,3}$/.test(h);
}

/** Every demo or test setting in a configuration, one line each naming its variable. */
export function demoSettings(env: Env): string[] {
  const problems: string[] = [];
  for (const [name, values] of Object.entries(DEMO_SECRETS)) {
    const value = env[name as keyof Env];
    if (typeof value === 'string' && values?.includes(value)) problems.push(`${name} is a demo or test value kept in the repository: set the real secret`);
  }
  if (isLoopback(env.STRIPE_API_HOST) || env.STRIPE_API_PROTOCOL === 'http') {
    problems.push(
      `STRIPE_API_HOST/STRIPE_API_PROTOCOL point the payment SDK at the local fake (${env.STRIPE_API_PROTOCOL}://${env.STRIPE_API_HOST}:${env.STRIPE_API_PORT}): set the payment provider's https host`,
    );
  }
  for (const name of ['NEXTAUTH_URL', 'APP_URL'] as const) {
    const value = env[name];
    if (!value) continue;
    const url = new URL(value);
    if (url.protocol === 'http:' && !isLoopback(url.hostname))
      problems.push(`${name} is plain http on ${url.hostname}: use https (plain http is only for localhost and 127.0.0.1)`);
  }
  return problems;
}

/**
 * Throws an EnvError naming each demo setting when a production process starts with one, unless
 * BRINEWRIGHT_DEMO=1 (the demo scripts and the tests). `next build` also runs with
 * NODE_ENV=production and is let through (its NEXT_PHASE says so).
 */
export function refuseDemoSettings(env: Env, source: Record<string, string | undefined> = process.env, what = 'Brinewright'): void {
  if (env.NODE_ENV !== 'production' || source.BRINEWRIGHT_DEMO === '1' || source.NEXT_PHASE === 'phase-production-build') return;
  const problems = demoSettings(env);
  if (!problems.length) return;
  throw new EnvError(
    `${what} refuses to start in production with demo settings (set BRINEWRIGHT_DEMO=1 only for a demo):\n${problems.map((p) => `- ${p}`).join('\n')}`,
  );
}

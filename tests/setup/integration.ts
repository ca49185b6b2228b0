import { afterAll, vi } from 'vitest';
import type { SessionUser } from '../../lib/auth/users';
import { claimSlot, slotCount, slotDatabaseUrl } from './slots';

// This file's own database for as long as it runs (tests/setup/integration-global.ts built one per slot).
process.env.BRINEWRIGHT_BASE_DATABASE_URL ??= process.env.DATABASE_URL;
const slot = await claimSlot(process.env.BRINEWRIGHT_BASE_DATABASE_URL!, slotCount('INTEGRATION_WORKERS'));
process.env.DATABASE_URL = slotDatabaseUrl(process.env.BRINEWRIGHT_BASE_DATABASE_URL!, slot.slot);

// Route handlers read the session from next-auth's session cookie (lib/auth/guard.ts); tests choose
// who is signed in with actAs() from tests/support/session.ts. The mocked cookie store carries a real
// token, encrypted with next-auth's own `encode` and the test secret, so the guard's decoding runs too.
vi.mock('next/headers', async (importOriginal) => {
  const original = await importOriginal<typeof import('next/headers')>();
  const { encode } = await import('next-auth/jwt');
  const { sessionCookieName, usesSecureCookies } = await import('../../lib/auth/session');
  return {
    ...original,
    cookies: vi.fn(async () => {
      const user = (globalThis as { __testUser?: SessionUser | null }).__testUser;
      const list = user
        ? [
            {
              name: sessionCookieName(usesSecureCookies(process.env.NEXTAUTH_URL)),
              value: await encode({
                token: { uid: user.id, roles: user.roles, email: user.email, name: user.name, sub: String(user.id) },
                secret: process.env.NEXTAUTH_SECRET!,
                maxAge: 3600,
              }),
            },
          ]
        : [];
      return {
        getAll: () => list,
        get: (name: string) => list.find((c) => c.name === name),
        has: (name: string) => list.some((c) => c.name === name),
        size: list.length,
      };
    }),
  };
});

process.env.NEXTAUTH_SECRET ??= 'integration-tests-secret-0123456789';

afterAll(async () => {
  const g = globalThis as { __brinewrightSequelize?: { close: () => Promise<void> } };
  await g.__brinewrightSequelize?.close();
  g.__brinewrightSequelize = undefined;
  (globalThis as { __brinewrightModels?: unknown }).__brinewrightModels = undefined;
  await slot.release();
});

import { afterAll, vi } from 'vitest';
import type { SessionUser } from '../../lib/auth/users';

// Route handlers read the session through next-auth's getServerSession; tests choose who is signed in
// with actAs() from tests/helpers/session.ts.
vi.mock('next-auth', async (importOriginal) => {
  const original = await importOriginal<typeof import('next-auth')>();
  return {
    ...original,
    getServerSession: vi.fn(async () => {
      const user = (globalThis as { __testUser?: SessionUser | null }).__testUser;
      return user ? { user, expires: new Date(Date.now() + 3_600_000).toISOString() } : null;
    }),
  };
});

process.env.NEXTAUTH_SECRET ??= 'integration-tests-secret-0123456789';

afterAll(async () => {
  const g = globalThis as { __brinewrightSequelize?: { close: () => Promise<void> } };
  await g.__brinewrightSequelize?.close();
  g.__brinewrightSequelize = undefined;
  (globalThis as { __brinewrightModels?: unknown }).__brinewrightModels = undefined;
});

import type { SessionUser } from '@/lib/auth/users';

/** Makes the next requests come from `user`; null signs out. */
export function actAs(user: SessionUser | null): void {
  (globalThis as { __testUser?: SessionUser | null }).__testUser = user;
}

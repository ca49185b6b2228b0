import type { Transaction } from 'sequelize';
import { db } from '@/models';

/** What the guard needs from the user row to accept a session: one primary-key read. */
export type AccountState = { roles: import('@/lib/roles').Role[]; sessionVersion: number; deactivatedAt: Date | null };

/** What a session token says about itself (lib/auth/session.ts reads it). */
export type SessionStamp = { sessionVersion: number; signedInAt: number };

/**
 * Whether a session may act now: the account exists and is not deactivated, the token's version is
 * the account's (a password change, a reset or "sign out everywhere" raised it), and the sign-in is
 * younger than the absolute lifetime, however often the rolling cookie was refreshed.
 */
export function sessionIsLive(stamp: SessionStamp, account: AccountState | null, options: { nowSeconds: number; maxAgeDays: number }): boolean {
  if (!account || account.deactivatedAt) return false;
  if (stamp.sessionVersion !== account.sessionVersion) return false;
  return options.nowSeconds - stamp.signedInAt <= options.maxAgeDays * 24 * 60 * 60;
}

/** Ends every session of a user, in the caller's transaction: the next request of each is signed out. */
export async function endSessions(userId: number, transaction?: Transaction): Promise<void> {
  await db().User.increment('sessionVersion', { by: 1, where: { id: userId }, transaction });
}

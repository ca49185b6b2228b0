import 'server-only';
import crypto from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import { getEnv } from '@/lib/env';
import { db } from '@/models';
import type { AccountToken, AccountTokenPurpose } from '@/models/account-token';

/** 32 random bytes, base64url: what the e-mailed link carries. */
const TOKEN = /^[A-Za-z0-9_-]{43}$/;

export const hashToken = (token: string) => crypto.createHash('sha256').update(token).digest('hex');

export type TokenState = { state: 'valid'; row: AccountToken } | { state: 'used' | 'expired' | 'invalid' };

/** A link into the app, from APP_URL. */
export function appLink(pathname: string, token: string): string {
  return `${getEnv().APP_URL.replace(/\/$/, '')}${pathname}?token=${encodeURIComponent(token)}`;
}

/**
 * Makes a single-use token for a user and stores its hash; earlier unused tokens of the same
 * purpose stop working, so only the newest e-mail's link opens.
 */
export async function issueToken(
  userId: number,
  purpose: AccountTokenPurpose,
  options: { validMinutes: number; newEmail?: string; transaction: Transaction; now?: Date },
): Promise<string> {
  const { AccountToken } = db();
  const now = options.now ?? new Date();
  const token = crypto.randomBytes(32).toString('base64url');
  await AccountToken.update({ usedAt: now }, { where: { userId, purpose, usedAt: null, expiresAt: { [Op.gt]: now } }, transaction: options.transaction });
  // Made and expiring by the same clock reading, so a link lives exactly its minutes.
  const expiresAt = new Date(now.getTime() + options.validMinutes * 60_000);
  await AccountToken.create(
    { userId, purpose, tokenHash: hashToken(token), newEmail: options.newEmail ?? null, expiresAt, createdAt: now },
    { transaction: options.transaction },
  );
  return token;
}

/** What a link's token is now: good to use, used (or replaced by a newer one), expired, or unknown. */
export async function readToken(token: string, purpose: AccountTokenPurpose, options: { transaction?: Transaction; now?: Date } = {}): Promise<TokenState> {
  if (!TOKEN.test(token)) return { state: 'invalid' };
  const row = await db().AccountToken.findOne({
    where: { tokenHash: hashToken(token), purpose },
    transaction: options.transaction,
    lock: options.transaction ? options.transaction.LOCK.UPDATE : undefined,
  });
  if (!row) return { state: 'invalid' };
  if (row.usedAt) return { state: 'used' };
  if (row.expiresAt.getTime() <= (options.now ?? new Date()).getTime()) return { state: 'expired' };
  return { state: 'valid', row };
}

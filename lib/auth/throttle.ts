import 'server-only';
import { QueryTypes } from 'sequelize';
import { db } from '@/models';
import { getEnv } from '@/lib/env';

export type ThrottleKeys = { account: string; address: string };

const bucketsFor = (keys: ThrottleKeys) => [`account:${keys.account}`, `address:${keys.address}`];

/**
 * True when the account or the address has used up its failed sign-ins in the current window.
 * Counts live in MariaDB so that every app server sees the same numbers.
 */
export async function isThrottled(keys: ThrottleKeys, now = new Date()): Promise<boolean> {
  const env = getEnv();
  const since = new Date(now.getTime() - env.SIGNIN_WINDOW_MINUTES * 60_000);
  const rows = await db().sequelize.query<{ bucket: string; failures: number }>(
    'SELECT bucket, failures FROM sign_in_throttles WHERE bucket IN (:buckets) AND windowStartedAt > :since',
    { replacements: { buckets: bucketsFor(keys), since }, type: QueryTypes.SELECT },
  );
  return rows.some((row) =>
    row.bucket.startsWith('account:') ? row.failures >= env.SIGNIN_MAX_PER_ACCOUNT : row.failures >= env.SIGNIN_MAX_PER_ADDRESS,
  );
}

/** Counts one failed sign-in against the account and the address; a stale window starts again at 1. */
export async function recordFailure(keys: ThrottleKeys, now = new Date()): Promise<void> {
  const env = getEnv();
  const since = new Date(now.getTime() - env.SIGNIN_WINDOW_MINUTES * 60_000);
  for (const bucket of bucketsFor(keys)) {
    // `failures` is assigned first so that both conditions read the old windowStartedAt.
    await db().sequelize.query(
      `INSERT INTO sign_in_throttles (bucket, failures, windowStartedAt, createdAt, updatedAt)
       VALUES (:bucket, 1, :now, :now, :now)
       ON DUPLICATE KEY UPDATE
         failures = IF(windowStartedAt <= :since, 1, failures + 1),
         windowStartedAt = IF(windowStartedAt <= :since, :now, windowStartedAt),
         updatedAt = :now`,
      { replacements: { bucket, now, since } },
    );
  }
}

/** A successful sign-in clears the account's count (the address keeps its own). */
export async function clearAccount(account: string): Promise<void> {
  await db().sequelize.query('DELETE FROM sign_in_throttles WHERE bucket = :bucket', { replacements: { bucket: `account:${account}` } });
}

import 'server-only';
import { QueryTypes } from 'sequelize';
import { db } from '@/models';

export type RateLimitResult = { allowed: boolean; hits: number; limit: number; retryAfterSeconds: number };

/**
 * Counts one request against `bucket` in a fixed window of `windowSeconds` and says whether it is
 * within `limit`. One INSERT … ON DUPLICATE KEY UPDATE, so concurrent requests on several app
 * servers each count once; `hits` is assigned before `windowStartedAt` so both read the old window.
 */
export async function hitRateLimit(bucket: string, limit: number, windowSeconds: number, now: Date = new Date()): Promise<RateLimitResult> {
  const { sequelize } = db();
  const since = new Date(now.getTime() - windowSeconds * 1000);
  const key = bucket.slice(0, 200);
  await sequelize.query(
    `INSERT INTO rate_limits (bucket, hits, windowStartedAt, createdAt, updatedAt)
     VALUES (:key, 1, :now, :now, :now)
     ON DUPLICATE KEY UPDATE
       hits = IF(windowStartedAt <= :since, 1, hits + 1),
       windowStartedAt = IF(windowStartedAt <= :since, :now, windowStartedAt),
       updatedAt = :now`,
    { replacements: { key, now, since } },
  );
  const [row] = await sequelize.query<{ hits: number; windowStartedAt: Date }>('SELECT hits, windowStartedAt FROM rate_limits WHERE bucket = :key', {
    replacements: { key },
    type: QueryTypes.SELECT,
  });
  const hits = Number(row?.hits ?? 1);
  const windowEnds = new Date(row?.windowStartedAt ?? now).getTime() + windowSeconds * 1000;
  return { allowed: hits <= limit, hits, limit, retryAfterSeconds: Math.max(1, Math.ceil((windowEnds - now.getTime()) / 1000)) };
}

/** Drops windows that ended long ago (housekeeping; a stale row is also reset on its next hit). */
export async function pruneRateLimits(olderThanSeconds: number, now: Date = new Date()): Promise<void> {
  await db().sequelize.query('DELETE FROM rate_limits WHERE windowStartedAt < :cutoff', {
    replacements: { cutoff: new Date(now.getTime() - olderThanSeconds * 1000) },
  });
}

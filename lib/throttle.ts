import 'server-only';
import { QueryTypes } from 'sequelize';
import { AppError } from '@/lib/errors';
import { db } from '@/models';

/** One counted limit: at most `max` attempts per fixed window of `windowSeconds` in `bucket`. */
export type Limit = { bucket: string; max: number; windowSeconds: number };

export type Count = Limit & { hits: number };

export type Verdict = { allowed: boolean; retryAfterSeconds: number; counts: Count[] };

/** 429 with a Retry-After header; the JSON body carries the same number. */
export class TooManyAttempts extends AppError {
  readonly retryAfterSeconds: number;

  constructor(message: string, retryAfterSeconds: number) {
    super('rate_limit', message, { extra: { retryAfterSeconds } });
    this.name = 'TooManyAttempts';
    this.retryAfterSeconds = retryAfterSeconds;
  }

  override toResponse(init: ResponseInit = {}): Response {
    const response = super.toResponse(init);
    response.headers.set('Retry-After', String(this.retryAfterSeconds));
    return response;
  }
}

const keyOf = (bucket: string) => bucket.slice(0, 200);
const isDeadlock = (error: unknown) => /deadlock/i.test(String((error as { message?: string })?.message ?? ''));

/**
 * Counts one attempt in a bucket with one statement and answers this attempt's place in the
 * window. On a duplicate key the new count goes through LAST_INSERT_ID(expr), which the server
 * hands back in the statement's own reply (insertId), so the number is exactly this attempt's,
 * however many run at once on however many app servers; a fresh row (affectedRows 1) is the first.
 */
async function countOne(limit: Limit, now: Date): Promise<number> {
  const { sequelize } = db();
  const since = new Date(now.getTime() - limit.windowSeconds * 1000);
  for (let attempt = 1; ; attempt += 1) {
    try {
      // `hits` is assigned before `windowStartedAt`, so both conditions read the old window.
      // Raw SQL: one INSERT … ON DUPLICATE KEY UPDATE counts and resets the window atomically; LAST_INSERT_ID carries the new count back.
      const [insertId, affectedRows] = (await sequelize.query(
        `INSERT INTO rate_limits (bucket, hits, windowStartedAt, createdAt, updatedAt)
         VALUES (:key, 1, :now, :now, :now)
         ON DUPLICATE KEY UPDATE
           hits = LAST_INSERT_ID(IF(windowStartedAt <= :since, 1, hits + 1)),
           windowStartedAt = IF(windowStartedAt <= :since, :now, windowStartedAt),
           updatedAt = :now`,
        { replacements: { key: keyOf(limit.bucket), now, since }, type: QueryTypes.INSERT },
      )) as unknown as [number | bigint, number];
      return affectedRows === 1 ? 1 : Number(insertId);
    } catch (error) {
      // Two first attempts on a new bucket can deadlock on the unique index; MariaDB rolled one back.
      if (attempt < 4 && isDeadlock(error)) continue;
      throw error;
    }
  }
}

/** Seconds until the window of each bucket ends (read only when an attempt is refused). */
async function secondsLeft(limits: Limit[], now: Date): Promise<number> {
  // Raw SQL: rate_limits has no model (these four statements are its only readers and writers).
  const rows = await db().sequelize.query<{ bucket: string; windowStartedAt: Date }>(
    'SELECT bucket, windowStartedAt FROM rate_limits WHERE bucket IN (:keys)',
    {
      replacements: { keys: limits.map((l) => keyOf(l.bucket)) },
      type: QueryTypes.SELECT,
    },
  );
  const ends = limits.map((l) => {
    const row = rows.find((r) => r.bucket === keyOf(l.bucket));
    return new Date(row?.windowStartedAt ?? now).getTime() + l.windowSeconds * 1000;
  });
  return Math.max(1, Math.ceil((Math.max(...ends) - now.getTime()) / 1000));
}

/**
 * Counts one attempt in every bucket (each atomically, side by side) and says whether all are
 * within their max; a refused attempt still counts. Several app servers share the counts.
 */
export async function take(limits: Limit[], now: Date = new Date()): Promise<Verdict> {
  const hits = await Promise.all(limits.map((limit) => countOne(limit, now)));
  const counts = limits.map((limit, i) => ({ ...limit, hits: hits[i] }));
  const over = counts.filter((c) => c.hits > c.max);
  return { allowed: over.length === 0, retryAfterSeconds: over.length ? await secondsLeft(over, now) : 0, counts };
}

/** Takes back one attempt from each bucket (a right password, a good code): only failures add up. */
export async function giveBack(limits: Pick<Limit, 'bucket'>[]): Promise<void> {
  if (!limits.length) return;
  // Raw SQL: an arithmetic UPDATE on several buckets in one statement, never below zero.
  await db().sequelize.query('UPDATE rate_limits SET hits = hits - 1 WHERE bucket IN (:keys) AND hits > 0', {
    replacements: { keys: limits.map((l) => keyOf(l.bucket)) },
  });
}

/** Drops windows that ended long ago (housekeeping; a stale row is also reset on its next hit). */
export async function pruneThrottles(olderThanSeconds: number, now: Date = new Date()): Promise<void> {
  // Raw SQL: rate_limits has no model.
  await db().sequelize.query('DELETE FROM rate_limits WHERE windowStartedAt < :cutoff', {
    replacements: { cutoff: new Date(now.getTime() - olderThanSeconds * 1000) },
  });
}

/** Counts the attempt and throws TooManyAttempts (429) when any limit is used up. */
export async function takeOrThrow(limits: Limit[], message: string, now: Date = new Date()): Promise<Verdict> {
  const verdict = await take(limits, now);
  if (!verdict.allowed) throw new TooManyAttempts(message, verdict.retryAfterSeconds);
  return verdict;
}

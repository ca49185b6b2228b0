import 'server-only';
import { QueryTypes } from 'sequelize';
import { AppError } from '@/lib/errors';
import { db } from '@/models';

/** One counted limit: at most `max` attempts per fixed window of `windowSeconds` in `bucket`. */
export type Limit = { bucket: string; max: number; windowSeconds: number };

export type Count = Limit & { hits: number; retryAfterSeconds: number };

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
 * Counts one attempt in every bucket, in one transaction: each upsert holds its row's lock until
 * the commit, so the count read back is exactly this attempt's place however many run at once, and
 * several app servers share it. Refused when any bucket is past its max (the attempt still counts).
 */
export async function take(limits: Limit[], now: Date = new Date()): Promise<Verdict> {
  const { sequelize } = db();
  // One order for every caller, so two attempts on the same buckets never wait on each other in a circle.
  const sorted = [...limits].sort((a, b) => (keyOf(a.bucket) < keyOf(b.bucket) ? -1 : 1));
  for (let attempt = 1; ; attempt += 1) {
    try {
      const counts = await sequelize.transaction(async (transaction) => {
        const out: Count[] = [];
        for (const limit of sorted) {
          const key = keyOf(limit.bucket);
          const since = new Date(now.getTime() - limit.windowSeconds * 1000);
          // `hits` is assigned before `windowStartedAt`, so both conditions read the old window.
          await sequelize.query(
            `INSERT INTO rate_limits (bucket, hits, windowStartedAt, createdAt, updatedAt)
             VALUES (:key, 1, :now, :now, :now)
             ON DUPLICATE KEY UPDATE
               hits = IF(windowStartedAt <= :since, 1, hits + 1),
               windowStartedAt = IF(windowStartedAt <= :since, :now, windowStartedAt),
               updatedAt = :now`,
            { replacements: { key, now, since }, transaction },
          );
          const [row] = await sequelize.query<{ hits: number; windowStartedAt: Date }>('SELECT hits, windowStartedAt FROM rate_limits WHERE bucket = :key', {
            replacements: { key },
            type: QueryTypes.SELECT,
            transaction,
          });
          const windowEnds = new Date(row?.windowStartedAt ?? now).getTime() + limit.windowSeconds * 1000;
          out.push({ ...limit, hits: Number(row?.hits ?? 1), retryAfterSeconds: Math.max(1, Math.ceil((windowEnds - now.getTime()) / 1000)) });
        }
        return out;
      });
      const over = counts.filter((c) => c.hits > c.max);
      return { allowed: over.length === 0, retryAfterSeconds: Math.max(0, ...over.map((c) => c.retryAfterSeconds)), counts };
    } catch (error) {
      // Two first attempts on a new bucket can deadlock on the unique index; MariaDB rolled one back.
      if (attempt < 4 && isDeadlock(error)) continue;
      throw error;
    }
  }
}

/** Takes back one attempt from each bucket (a right password, a good code): only failures add up. */
export async function giveBack(limits: Pick<Limit, 'bucket'>[]): Promise<void> {
  if (!limits.length) return;
  await db().sequelize.query('UPDATE rate_limits SET hits = hits - 1 WHERE bucket IN (:keys) AND hits > 0', { replacements: { keys: limits.map((l) => keyOf(l.bucket)) } });
}

/** Forgets a bucket's count. */
export async function clear(bucket: string): Promise<void> {
  await db().sequelize.query('DELETE FROM rate_limits WHERE bucket = :key', { replacements: { key: keyOf(bucket) } });
}

/** Drops windows that ended long ago (housekeeping; a stale row is also reset on its next hit). */
export async function pruneThrottles(olderThanSeconds: number, now: Date = new Date()): Promise<void> {
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

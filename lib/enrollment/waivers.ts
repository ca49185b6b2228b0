import 'server-only';
import crypto from 'node:crypto';
import { UniqueConstraintError, type Transaction } from 'sequelize';
import { audit } from '@/lib/audit';
import { getEnv } from '@/lib/env';
import { AppError } from '@/lib/errors';
import { giveBack, takeOrThrow } from '@/lib/throttle';
import type { WaiverSchema } from '@/lib/validations/waiver';
import { db, type FeeWaiver } from '@/models';
import type { z } from 'zod';

// One answer for every failure, so a guess learns nothing about which codes exist.
export const WAIVER_REFUSED = 'That waiver code cannot be used for this course. Check it with the program coordinator.';
const refused = () => new AppError('bad_request', WAIVER_REFUSED, { fields: { waiverCode: [WAIVER_REFUSED] } });

const usable = (waiver: FeeWaiver | null, courseId: number, now: Date): waiver is FeeWaiver =>
  Boolean(waiver) &&
  waiver!.expiresAt.getTime() > now.getTime() &&
  (waiver!.courseId === null || waiver!.courseId === courseId) &&
  waiver!.uses < waiver!.maxUses;

/**
 * Checks a typed code before any row is locked: the attempt is counted per account and per client
 * address first (WAIVER_MAX_PER_ACCOUNT / WAIVER_MAX_PER_ADDRESS per WAIVER_WINDOW_MINUTES, 429
 * past either), a usable code takes its attempt back, so only wrong codes add up. Returns its id.
 */
export async function checkWaiverCode({
  code,
  courseId,
  userId,
  address,
  now = new Date(),
}: {
  code: string;
  courseId: number;
  userId: number;
  address: string;
  now?: Date;
}): Promise<number> {
  const env = getEnv();
  const windowSeconds = env.WAIVER_WINDOW_MINUTES * 60;
  const limits = [
    { bucket: `waiver:account:${userId}`, max: env.WAIVER_MAX_PER_ACCOUNT, windowSeconds },
    { bucket: `waiver:address:${address}`, max: env.WAIVER_MAX_PER_ADDRESS, windowSeconds },
  ];
  await takeOrThrow(limits, 'Too many wrong waiver codes. Please wait before trying another, or ask the program coordinator for the code.', now);
  const waiver = await db().FeeWaiver.findOne({ where: { code: code.trim().toUpperCase() } });
  if (!usable(waiver, courseId, now)) throw refused();
  await giveBack(limits);
  return waiver.id;
}

/**
 * Uses one redemption of a checked waiver inside the caller's transaction. The waiver row is locked
 * and checked again, so two learners using the last remaining use cannot both get it.
 */
export async function redeemWaiver({
  waiverId,
  courseId,
  transaction,
  now = new Date(),
}: {
  waiverId: number;
  courseId: number;
  transaction: Transaction;
  now?: Date;
}): Promise<FeeWaiver> {
  const waiver = await db().FeeWaiver.findByPk(waiverId, { transaction, lock: transaction.LOCK.UPDATE });
  if (!usable(waiver, courseId, now)) throw refused();
  await waiver.increment('uses', { by: 1, transaction });
  await waiver.reload({ transaction });
  return waiver;
}

// Without look-alikes (no 0/O, 1/I/L): 31 characters; 12 of them are about 59 bits.
export const WAIVER_ALPHABET = 'ABCDEFGHJKMNPQRSTUVWXYZ23456789';
export const WAIVER_RANDOM_LENGTH = 12;

/** A readable code such as BRINE-7K3Q-X2MP-9TRA: 12 random characters after the prefix, drawn without bias. */
export function generateWaiverCode(): string {
  const chars = Array.from({ length: WAIVER_RANDOM_LENGTH }, () => WAIVER_ALPHABET[crypto.randomInt(WAIVER_ALPHABET.length)]);
  return `BRINE-${chars.slice(0, 4).join('')}-${chars.slice(4, 8).join('')}-${chars.slice(8).join('')}`;
}

/** Creates a waiver code (a given one, or a generated one); it works until the end of expiresOn (UTC). */
export async function createWaiver(input: z.output<typeof WaiverSchema>, actorId: number): Promise<FeeWaiver> {
  const { FeeWaiver, sequelize } = db();
  const expiresAt = new Date(`${input.expiresOn}T23:59:59.000Z`);
  if (expiresAt.getTime() <= Date.now())
    throw new AppError('bad_request', 'The last day must be today or later.', { fields: { expiresOn: ['The last day must be today or later.'] } });
  try {
    return await sequelize.transaction(async (transaction) => {
      const waiver = await FeeWaiver.create(
        { code: input.code ?? generateWaiverCode(), courseId: input.courseId, createdById: actorId, maxUses: input.maxUses, expiresAt, note: input.note },
        { transaction },
      );
      await audit(
        {
          actorId,
          action: 'waiver.created',
          subjectType: 'fee_waiver',
          subjectId: waiver.id,
          data: { code: waiver.code, maxUses: waiver.maxUses, courseId: waiver.courseId },
        },
        { transaction },
      );
      return waiver;
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError)
      throw new AppError('conflict', 'That code already exists; choose another.', { fields: { code: ['That code already exists.'] } });
    throw error;
  }
}

import 'server-only';
import crypto from 'node:crypto';
import { UniqueConstraintError, type Transaction } from 'sequelize';
import { audit } from '@/lib/audit';
import { AppError } from '@/lib/errors';
import type { WaiverSchema } from '@/lib/validations/waiver';
import { db, type FeeWaiver } from '@/models';
import type { z } from 'zod';

const badCode = (message: string) => new AppError('bad_request', message, { fields: { waiverCode: [message] } });

/**
 * Uses one redemption of a waiver code inside the caller's transaction. The waiver row is locked,
 * so two learners using the last remaining use cannot both get it.
 */
export async function redeemWaiver({ code, courseId, transaction, now = new Date() }: { code: string; courseId: number; transaction: Transaction; now?: Date }): Promise<FeeWaiver> {
  const waiver = await db().FeeWaiver.findOne({ where: { code: code.trim().toUpperCase() }, transaction, lock: transaction.LOCK.UPDATE });
  if (!waiver) throw badCode('That waiver code is not known. Check it with the program coordinator.');
  if (waiver.expiresAt.getTime() <= now.getTime()) throw badCode('That waiver code has expired.');
  if (waiver.courseId !== null && waiver.courseId !== courseId) throw badCode('That waiver code is for a different course.');
  if (waiver.uses >= waiver.maxUses) throw badCode('That waiver code has been used as many times as it allows.');
  await waiver.increment('uses', { by: 1, transaction });
  await waiver.reload({ transaction });
  return waiver;
}

/** A readable code such as BRINE-7K3QX2, avoiding letters that look alike. */
export function generateWaiverCode(): string {
  const alphabet = 'ABCDEFGHJKLMNPQRSTUVWXYZ23456789';
  const bytes = crypto.randomBytes(6);
  return `BRINE-${Array.from(bytes, (b) => alphabet[b % alphabet.length]).join('')}`;
}

/** Creates a waiver code (a given one, or a generated one); it works until the end of expiresOn (UTC). */
export async function createWaiver(input: z.output<typeof WaiverSchema>, actorId: number): Promise<FeeWaiver> {
  const { FeeWaiver, sequelize } = db();
  const expiresAt = new Date(`${input.expiresOn}T23:59:59.000Z`);
  if (expiresAt.getTime() <= Date.now()) throw new AppError('bad_request', 'The last day must be today or later.', { fields: { expiresOn: ['The last day must be today or later.'] } });
  try {
    return await sequelize.transaction(async (transaction) => {
      const waiver = await FeeWaiver.create({ code: input.code ?? generateWaiverCode(), courseId: input.courseId, createdById: actorId, maxUses: input.maxUses, expiresAt, note: input.note }, { transaction });
      await audit({ actorId, action: 'waiver.created', subjectType: 'fee_waiver', subjectId: waiver.id, data: { code: waiver.code, maxUses: waiver.maxUses, courseId: waiver.courseId } }, { transaction });
      return waiver;
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw new AppError('conflict', 'That code already exists; choose another.', { fields: { code: ['That code already exists.'] } });
    throw error;
  }
}

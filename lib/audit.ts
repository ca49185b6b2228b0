import 'server-only';
import type { Transaction } from 'sequelize';
import { db } from '@/models';

export type AuditEntry = { actorId: number | null; action: string; subjectType: string; subjectId: string | number; data?: Record<string, unknown> | null };

/** Adds one audit row, inside the caller's transaction when one is given. */
export async function audit(entry: AuditEntry, options: { transaction?: Transaction } = {}): Promise<void> {
  await db().AuditLog.create(
    { actorId: entry.actorId, action: entry.action, subjectType: entry.subjectType, subjectId: String(entry.subjectId), data: entry.data ?? null },
    { transaction: options.transaction },
  );
}

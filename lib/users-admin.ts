import 'server-only';
import { endSessions } from '@/lib/auth/sessions';
import { AppError } from '@/lib/errors';
import { normalizeRoles, type Role } from '@/lib/roles';
import type { RoleChange } from '@/lib/validations/user-admin';
import { db } from '@/models';

/** Changes a user's set of roles and records who did it. An admin cannot take away their own admin role. */
export async function changeRoles(actorId: number, change: RoleChange): Promise<{ roles: Role[] }> {
  const to = normalizeRoles(change.roles);
  if (change.userId === actorId && !to.includes('admin')) {
    throw new AppError('conflict', 'You cannot remove your own admin role; ask another admin.');
  }
  const { User, AuditLog, sequelize } = db();
  return sequelize.transaction(async (transaction) => {
    const user = await User.findByPk(change.userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw new AppError('not_found', 'That user does not exist.');
    const from = user.roles;
    if (from.join(',') === to.join(',')) return { roles: to };
    user.roles = to;
    await user.save({ transaction });
    await AuditLog.create({ actorId, action: 'user.roles_changed', subjectType: 'user', subjectId: String(user.id), data: { from, to } }, { transaction });
    return { roles: to };
  });
}

export type Activation = { id: number; deactivatedAt: Date | null };

/**
 * Deactivates an account: it can no longer sign in and every session of it ends at its next request
 * (lib/auth/sessions.ts); its enrollments, payments, certificates and audit entries stay. An admin
 * cannot deactivate themselves. Deactivating twice changes nothing more.
 */
export async function deactivateUser(actorId: number, userId: number): Promise<Activation> {
  if (userId === actorId) throw new AppError('conflict', 'You cannot deactivate your own account; ask another admin.');
  const { User, AuditLog, sequelize } = db();
  return sequelize.transaction(async (transaction) => {
    const user = await User.findByPk(userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw new AppError('not_found', 'That user does not exist.');
    if (user.deactivatedAt) return { id: user.id, deactivatedAt: user.deactivatedAt };
    user.deactivatedAt = new Date();
    await user.save({ transaction });
    await endSessions(user.id, transaction);
    await AuditLog.create({ actorId, action: 'user.deactivated', subjectType: 'user', subjectId: String(user.id), data: null }, { transaction });
    return { id: user.id, deactivatedAt: user.deactivatedAt };
  });
}

/** Lets a deactivated account sign in again (with its old password); its old sessions stay ended. */
export async function reactivateUser(actorId: number, userId: number): Promise<Activation> {
  const { User, AuditLog, sequelize } = db();
  return sequelize.transaction(async (transaction) => {
    const user = await User.findByPk(userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw new AppError('not_found', 'That user does not exist.');
    if (!user.deactivatedAt) return { id: user.id, deactivatedAt: null };
    user.deactivatedAt = null;
    await user.save({ transaction });
    await AuditLog.create({ actorId, action: 'user.reactivated', subjectType: 'user', subjectId: String(user.id), data: null }, { transaction });
    return { id: user.id, deactivatedAt: null };
  });
}

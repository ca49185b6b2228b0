import 'server-only';
import { AppError } from '@/lib/errors';
import { normalizeRoles } from '@/lib/roles';
import type { RoleChange } from '@/lib/validations/role-change';
import { db } from '@/models';

/** Changes a user's set of roles and records who did it. An admin cannot take away their own admin role. */
export async function changeRoles(actorId: number, change: RoleChange): Promise<void> {
  const to = normalizeRoles(change.roles);
  if (change.userId === actorId && !to.includes('admin')) {
    throw new AppError('conflict', 'You cannot remove your own admin role; ask another admin.');
  }
  const { User, AuditLog, sequelize } = db();
  await sequelize.transaction(async (transaction) => {
    const user = await User.findByPk(change.userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw new AppError('not_found', 'That user does not exist.');
    const from = user.roles;
    if (from.join(',') === to.join(',')) return;
    user.roles = to;
    await user.save({ transaction });
    await AuditLog.create({ actorId, action: 'user.roles_changed', subjectType: 'user', subjectId: String(user.id), data: { from, to } }, { transaction });
  });
}

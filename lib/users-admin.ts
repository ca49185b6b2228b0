import 'server-only';
import { AppError } from '@/lib/errors';
import type { RoleChange } from '@/lib/validations/role-change';
import { db } from '@/models';

/** Changes a user's role and records who did it. An admin cannot take away their own admin role. */
export async function changeRole(actorId: number, change: RoleChange): Promise<void> {
  if (change.userId === actorId && change.role !== 'admin') {
    throw new AppError('conflict', 'You cannot remove your own admin role; ask another admin.');
  }
  const { User, AuditLog, sequelize } = db();
  await sequelize.transaction(async (transaction) => {
    const user = await User.findByPk(change.userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw new AppError('not_found', 'That user does not exist.');
    const from = user.role;
    if (from === change.role) return;
    user.role = change.role;
    await user.save({ transaction });
    await AuditLog.create(
      { actorId, action: 'user.role_changed', subjectType: 'user', subjectId: String(user.id), data: { from, to: change.role } },
      { transaction },
    );
  });
}

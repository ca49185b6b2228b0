import 'server-only';
import { hashPassword } from '@/lib/auth/users';
import { AppError } from '@/lib/errors';
import { normalizeRoles, type Role } from '@/lib/roles';
import { AdminCreateSchema, type AdminCreateInput } from '@/lib/validations/user';
import { db } from '@/models';

export type AdminCreateResult =
  { outcome: 'created'; userId: number } | { outcome: 'promoted'; userId: number; previousRoles: Role[] } | { outcome: 'unchanged'; userId: number };

/** Whether an account exists for the address, so the command asks for a password only when it will create one. */
export async function accountExists(email: string): Promise<boolean> {
  return (await db().User.count({ where: { email: email.trim().toLowerCase() } })) > 0;
}

/**
 * Creates an admin account, or makes an existing account an admin; running it again changes
 * nothing. An existing account keeps its name and password. Audited with no actor: the command
 * runs on the server, outside any session.
 */
export async function createOrPromoteAdmin(raw: AdminCreateInput): Promise<AdminCreateResult> {
  const input = AdminCreateSchema.parse(raw);
  const { User, AuditLog, sequelize } = db();
  return sequelize.transaction(async (transaction) => {
    const existing = await User.findOne({ where: { email: input.email }, transaction, lock: transaction.LOCK.UPDATE });
    if (existing) {
      if (existing.roles.includes('admin')) return { outcome: 'unchanged', userId: existing.id };
      const previousRoles = existing.roles;
      // Admin is added to the roles the account holds: a learner made admin keeps their Pantry.
      await existing.update({ roles: normalizeRoles([...previousRoles, 'admin']) }, { transaction });
      await AuditLog.create(
        {
          actorId: null,
          action: 'user.roles_changed',
          subjectType: 'user',
          subjectId: String(existing.id),
          data: { from: previousRoles, to: normalizeRoles([...previousRoles, 'admin']), by: 'admin:create' },
        },
        { transaction },
      );
      return { outcome: 'promoted', userId: existing.id, previousRoles };
    }
    if (!input.password) throw new AppError('bad_request', 'A new admin account needs a password: set ADMIN_PASSWORD or type one when asked.');
    // The person running the command on the server vouches for the address.
    const user = await User.create(
      { email: input.email, name: input.name, roles: ['admin'], passwordHash: await hashPassword(input.password), emailVerifiedAt: new Date() },
      { transaction },
    );
    await AuditLog.create(
      { actorId: null, action: 'user.admin_created', subjectType: 'user', subjectId: String(user.id), data: { by: 'admin:create' } },
      { transaction },
    );
    return { outcome: 'created', userId: user.id };
  });
}

import { QueryTypes } from 'sequelize';
import { syncCourses } from '@/lib/courses/sync';
import { hashPassword, type SessionUser } from '@/lib/auth/users';
import { normalizeRoles, type Role } from '@/lib/roles';
import { db } from '@/models';

/** Empties every table (not the migration record) so each test file starts clean. */
export async function resetDatabase(): Promise<void> {
  const { sequelize } = db();
  const tables = await sequelize.query<{ name: string }>(
    "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() AND table_name NOT IN ('SequelizeMeta', 'SequelizeData')",
    { type: QueryTypes.SELECT },
  );
  await sequelize.transaction(async (transaction) => {
    await sequelize.query('SET FOREIGN_KEY_CHECKS = 0', { transaction });
    for (const { name } of tables) await sequelize.query(`TRUNCATE TABLE \`${name}\``, { transaction });
    await sequelize.query('SET FOREIGN_KEY_CHECKS = 1', { transaction });
  });
}

let counter = 0;

/** Creates a user with a role or a set of roles and a confirmed address (unless `confirmed: false`); the password is 'test-password-123'. */
export async function createUser(
  roles: Role | readonly Role[] = 'learner',
  overrides: Partial<{ email: string; name: string; deactivatedAt: Date; confirmed: boolean }> = {},
): Promise<SessionUser> {
  counter += 1;
  const set = normalizeRoles(typeof roles === 'string' ? [roles] : roles);
  const tag = set.join('-');
  const user = await db().User.create({
    email: overrides.email ?? `${tag}${counter}-${Date.now()}@test.example`,
    name: overrides.name ?? `Test ${tag} ${counter}`,
    roles: set,
    deactivatedAt: overrides.deactivatedAt ?? null,
    passwordHash: await hashPassword('test-password-123'),
    emailVerifiedAt: overrides.confirmed === false ? null : new Date(),
  });
  return { id: user.id, email: user.email, name: user.name, roles: user.roles };
}

/** The two courses of the catalog, brought in from content/courses/ as `npm run db:migrate` does. */
export async function createCourses() {
  const { Course, sequelize } = db();
  await syncCourses(sequelize);
  const flagship = (await Course.findOne({ where: { slug: 'pickling-and-canning' } }))!;
  const refresher = (await Course.findOne({ where: { slug: 'volunteer-refresher' } }))!;
  return { flagship, refresher };
}

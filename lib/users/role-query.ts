import 'server-only';
import { Op, Sequelize, type WhereOptions } from 'sequelize';
import { rolesAllowing, type Role } from '@/lib/roles';

/** A where clause for users holding a role that allows one of `allowed` (FIND_IN_SET on the SET column). */
export function holdingRoleFor(allowed: readonly Role[]): WhereOptions {
  return { [Op.or]: rolesAllowing(allowed).map((r) => Sequelize.where(Sequelize.fn('FIND_IN_SET', r, Sequelize.col('roles')), { [Op.gt]: 0 })) };
}

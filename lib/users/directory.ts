import 'server-only';
import { Op, type WhereOptions } from 'sequelize';
import type { Role } from '@/lib/roles';
import { USERS_PAGE_SIZE, type UserSearch } from '@/lib/validations/user-admin';
import { db, type User } from '@/models';

export type DirectoryUser = { id: number; name: string; email: string; roles: Role[]; deactivatedAt: Date | null; createdAt: Date };
export type DirectoryPage = { users: DirectoryUser[]; total: number; page: number; pages: number; pageSize: number };

/** LIKE matches the search as typed: % and _ are not wildcards here. */
const likeText = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/** One page of accounts, by name, whose name or e-mail contains the search (any case). */
export async function fetchUsersPage({ q, page }: UserSearch, pageSize = USERS_PAGE_SIZE): Promise<DirectoryPage> {
  const where: WhereOptions<User> = q ? { [Op.or]: [{ name: { [Op.like]: likeText(q) } }, { email: { [Op.like]: likeText(q) } }] } : {};
  const { User } = db();
  const total = await User.count({ where });
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const current = Math.min(page, pages);
  const rows = await User.findAll({
    where,
    attributes: ['id', 'name', 'email', 'roles', 'deactivatedAt', 'createdAt'],
    order: [
      ['name', 'ASC'],
      ['id', 'ASC'],
    ],
    limit: pageSize,
    offset: (current - 1) * pageSize,
  });
  return {
    users: rows.map((u) => ({ id: u.id, name: u.name, email: u.email, roles: u.roles, deactivatedAt: u.deactivatedAt, createdAt: u.createdAt })),
    total,
    page: current,
    pages,
    pageSize,
  };
}

import { z } from 'zod';
import { ROLES } from '@/lib/roles';

/** A set of roles: at least one, each known (repeats are dropped by normalizeRoles). */
export const RoleSetSchema = z
  .array(z.enum(ROLES, { error: 'Choose roles among learner, instructor, coordinator and admin.' }), { error: 'Choose at least one role.' })
  .min(1, 'Choose at least one role.')
  .max(ROLES.length, 'Choose each role at most once.');

export const UserIdSchema = z.coerce.number().int().positive().max(4_294_967_295);

/** POST /api/admin/users/:id/roles */
export const RolesBodySchema = z.object({ roles: RoleSetSchema });
export type RolesBody = z.infer<typeof RolesBodySchema>;

export const RoleChangeSchema = RolesBodySchema.extend({ userId: UserIdSchema });
export type RoleChange = z.infer<typeof RoleChangeSchema>;

export const USERS_PAGE_SIZE = 25;

/** The admin's user list: search by name or e-mail, and the page, as they stand in the address. */
export const UserSearchSchema = z.object({
  q: z.string().trim().max(100, 'Search with at most 100 characters.').catch('').default(''),
  page: z.coerce.number().int().min(1).max(100_000).catch(1).default(1),
});
export type UserSearch = z.infer<typeof UserSearchSchema>;

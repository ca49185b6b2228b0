import { z } from 'zod';
import { ROLES } from '@/lib/roles';

/** A set of roles: at least one, each known, repeats dropped by the caller (normalizeRoles). */
export const RoleSetSchema = z
  .array(z.enum(ROLES, { error: 'Choose roles among learner, instructor, coordinator and admin.' }), { error: 'Choose at least one role.' })
  .min(1, 'Choose at least one role.')
  .max(ROLES.length, 'Choose each role at most once.');

export const RoleChangeSchema = z.object({
  userId: z.coerce.number({ error: 'Choose a user.' }).int().positive('Choose a user.'),
  roles: RoleSetSchema,
});
export type RoleChange = z.infer<typeof RoleChangeSchema>;

import { z } from 'zod';
import { ROLES } from '@/lib/roles';

export const RoleChangeSchema = z.object({
  userId: z.coerce.number({ error: 'Choose a user.' }).int().positive('Choose a user.'),
  role: z.enum(ROLES, { error: 'Choose one of the roles: learner, instructor, coordinator or admin.' }),
});
export type RoleChange = z.infer<typeof RoleChangeSchema>;

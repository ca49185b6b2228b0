import { z } from 'zod';
import { RoleSetSchema } from './user-admin';
import { email, password, RegisterSchema } from './user';

/** POST /api/admin/invitations: whom to invite, with which roles. */
export const InviteSchema = z.object({ email, roles: RoleSetSchema });
export type InviteInput = z.infer<typeof InviteSchema>;

/** The link's token: 43 base64url characters (32 random bytes). */
export const InvitationTokenSchema = z
  .string({ error: 'The invitation link is incomplete.' })
  .regex(/^[A-Za-z0-9_-]{43}$/, 'The invitation link is incomplete. Open it again from the e-mail.');

/** POST /api/invitations/accept: the invitee's name and password, under the sign-up policy. */
export const AcceptInvitationSchema = z.object({ token: InvitationTokenSchema, name: RegisterSchema.shape.name, password });
export type AcceptInvitationInput = z.infer<typeof AcceptInvitationSchema>;

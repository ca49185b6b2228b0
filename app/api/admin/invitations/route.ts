import { requireRole } from '@/lib/auth/guard';
import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { inviteStaff } from '@/lib/users/invitations';
import { InviteSchema } from '@/lib/validations/invitation';

/** POST /api/admin/invitations { email, roles } — e-mails a single-use link; a second one to the address replaces the first. */
export const POST = route(async (request) => {
  const actor = await requireRole('admin');
  const input = parseOrThrow(InviteSchema, await readJson(request), 'invitation');
  const invitation = await inviteStaff(actor.id, input);
  return Response.json({ invitation: { ...invitation, expiresAt: invitation.expiresAt.toISOString() } }, { status: 201 });
});

import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { acceptInvitation } from '@/lib/users/invitations';
import { AcceptInvitationSchema } from '@/lib/validations/invitation';

/** POST /api/invitations/accept { token, name, password } — the invitee's account, once; the token is the only credential. */
export const POST = route(async (request) => {
  const input = parseOrThrow(AcceptInvitationSchema, await readJson(request), 'invitation form');
  const user = await acceptInvitation(input);
  return Response.json({ user: { id: user.userId, email: user.email } }, { status: 201 });
});

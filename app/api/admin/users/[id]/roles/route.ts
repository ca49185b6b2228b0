import { requireRole } from '@/lib/auth/guard';
import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { changeRoles } from '@/lib/users-admin';
import { RolesBodySchema, UserIdSchema } from '@/lib/validations/user-admin';

/** POST /api/admin/users/:id/roles { roles } — replaces the account's set of roles; audited. */
export const POST = route<{ params: Promise<{ id: string }> }>(async (request, { params }) => {
  const actor = await requireRole('admin');
  const userId = parseOrThrow(UserIdSchema, (await params).id, 'user id');
  const { roles } = parseOrThrow(RolesBodySchema, await readJson(request));
  return Response.json({ user: { id: userId, ...(await changeRoles(actor.id, { userId, roles })) } });
});

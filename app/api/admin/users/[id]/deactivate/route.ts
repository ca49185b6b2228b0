import { requireRole } from '@/lib/auth/guard';
import { parseOrThrow, route } from '@/lib/errors';
import { deactivateUser } from '@/lib/users-admin';
import { UserIdSchema } from '@/lib/validations/user-admin';

/** POST /api/admin/users/:id/deactivate — the account can no longer sign in and its sessions end; its records stay. */
export const POST = route<{ params: Promise<{ id: string }> }>(async (_request, { params }) => {
  const actor = await requireRole('admin');
  const userId = parseOrThrow(UserIdSchema, (await params).id, 'user id');
  const user = await deactivateUser(actor.id, userId);
  return Response.json({ user: { id: user.id, deactivatedAt: user.deactivatedAt?.toISOString() ?? null } });
});

import { requireRole } from '@/lib/auth/guard';
import { fetchEnrollmentStatus } from '@/lib/enrollment/queries';
import { AppError, route } from '@/lib/errors';
import { roleAllows } from '@/lib/roles';

// Polled by the checkout success page until the payment webhook has arrived.
export const GET = route<{ params: Promise<{ id: string }> }>(async (_request, { params }) => {
  const user = await requireRole();
  const id = Number((await params).id);
  if (!Number.isInteger(id) || id <= 0) throw new AppError('bad_request', 'That enrollment number is not valid.', { fields: { id: ['not a number'] } });
  const status = await fetchEnrollmentStatus({ id });
  // Someone else's enrollment is answered as missing, so its existence is not revealed.
  if (!status || (status.userId !== user.id && !roleAllows(user.roles, ['coordinator']))) throw new AppError('not_found', 'That enrollment does not exist.');
  const { userId: _userId, ...rest } = status;
  return Response.json({ enrollment: rest }, { headers: { 'Cache-Control': 'no-store' } });
});

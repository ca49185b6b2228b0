import { requireRole } from '@/lib/auth/guard';
import { AppError, parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { refundEnrollment } from '@/lib/payments/refunds';
import { RefundSchema } from '@/lib/validations/enrollment';

// Coordinator only: refunds the fee through the payment service, withdraws the enrollment, e-mails the learner.
export const POST = route<{ params: Promise<{ id: string }> }>(async (request, { params }) => {
  const user = await requireRole('coordinator');
  const id = Number((await params).id);
  if (!Number.isInteger(id) || id <= 0) throw new AppError('bad_request', 'That enrollment number is not valid.', { fields: { id: ['not a number'] } });
  const input = parseOrThrow(RefundSchema, await readJson(request), 'refund');
  const result = await refundEnrollment({ enrollmentId: id, actorId: user.id, reason: input.reason });
  return Response.json({ refund: result });
});

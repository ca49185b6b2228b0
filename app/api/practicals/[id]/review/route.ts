import { requireRole } from '@/lib/auth/guard';
import { AppError, parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { reviewPractical } from '@/lib/practicals/service';
import { reviewSchema } from '@/lib/validations/practical';

export const POST = route<{ params: Promise<{ id: string }> }>(async (request, { params }) => {
  const reviewer = await requireRole('instructor');
  const { id } = await params;
  if (!/^\d{1,10}$/.test(id)) throw new AppError('not_found', 'There is no such submission.');
  const input = parseOrThrow(reviewSchema, await readJson(request), 'review');
  const review = await reviewPractical(reviewer, Number(id), input);
  return Response.json({ review }, { status: 201 });
});

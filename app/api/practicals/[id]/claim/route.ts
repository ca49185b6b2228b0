import { requireRole } from '@/lib/auth/guard';
import { AppError, route } from '@/lib/errors';
import { claimPractical, releasePractical } from '@/lib/practicals/service';

type Context = { params: Promise<{ id: string }> };

async function practicalId(params: Context['params']): Promise<number> {
  const { id } = await params;
  if (!/^\d{1,10}$/.test(id)) throw new AppError('not_found', 'There is no such submission.');
  return Number(id);
}

// An instructor claims a waiting round to decide on it (one claimant at a time).
export const POST = route<Context>(async (_request, { params }) => {
  const viewer = await requireRole('instructor');
  return Response.json({ claim: await claimPractical(viewer, await practicalId(params)) }, { status: 201 });
});

// The claimant gives it back, or a coordinator releases another instructor's claim.
export const DELETE = route<Context>(async (_request, { params }) => {
  const viewer = await requireRole('instructor');
  return Response.json({ claim: await releasePractical(viewer, await practicalId(params)) });
});

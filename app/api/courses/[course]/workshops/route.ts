import { getCurrentUser } from '@/lib/auth/guard';
import { fetchUpcomingWorkshops } from '@/lib/enrollment/workshops';
import { AppError, route } from '@/lib/errors';

// Public: visitors see upcoming workshops and seats left; a signed-in learner also sees their own status.
export const GET = route<{ params: Promise<{ course: string }> }>(async (_request, { params }) => {
  const { course } = await params;
  const user = await getCurrentUser();
  const workshops = await fetchUpcomingWorkshops({ courseSlug: course, userId: user?.roles.includes('learner') ? user.id : null });
  if (!workshops) throw new AppError('not_found', 'There is no course with that name.');
  return Response.json({ workshops }, { headers: { 'Cache-Control': 'no-store' } });
});

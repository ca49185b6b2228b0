import { requireRole } from '@/lib/auth/guard';
import { route } from '@/lib/errors';
import { fetchPantry } from '@/lib/progress/pantry';

/** The signed-in learner's shelves of jars and the next step of each course. */
export const GET = route(async () => {
  const user = await requireRole('learner');
  const shelves = await fetchPantry(user.id);
  return Response.json({ shelves }, { headers: { 'cache-control': 'no-store' } });
});

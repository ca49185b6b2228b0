import { requireRole } from '@/lib/auth/guard';
import { fetchDeskOptions } from '@/lib/desk/enrollments';
import { route } from '@/lib/errors';

export const dynamic = 'force-dynamic';

/** GET /api/desk/options — the courses and workshops the desk's filters offer. */
export const GET = route(async () => {
  await requireRole('coordinator');
  return Response.json(await fetchDeskOptions(), { headers: { 'Cache-Control': 'no-store' } });
});

import { requireRole } from '@/lib/auth/guard';
import { DeskQuerySchema } from '@/lib/validations/certificate';
import { fetchDeskPage } from '@/lib/desk/enrollments';
import { parseOrThrow, route } from '@/lib/errors';

export const dynamic = 'force-dynamic';

/** GET /api/desk/enrollments?course=&workshop=&status=&eligible=&q=&page=&pageSize= — one page of the desk table. */
export const GET = route(async (request) => {
  await requireRole('coordinator');
  const query = parseOrThrow(DeskQuerySchema, Object.fromEntries(new URL(request.url).searchParams), 'filters');
  return Response.json(await fetchDeskPage(query), { headers: { 'Cache-Control': 'no-store' } });
});

import { requireRole } from '@/lib/auth/guard';
import { parseOrThrow, route } from '@/lib/errors';
import { fetchTastingTable } from '@/lib/practicals/data';
import { tastingTableQuerySchema } from '@/lib/validations/practical';

export const GET = route(async (request) => {
  await requireRole('instructor');
  const query = parseOrThrow(tastingTableQuerySchema, Object.fromEntries(new URL(request.url).searchParams), 'filters');
  return Response.json(await fetchTastingTable(query), { headers: { 'cache-control': 'private, no-store' } });
});

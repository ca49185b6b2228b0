import { z } from 'zod';
import { requireRole } from '@/lib/auth/guard';
import { DeskFilterSchema } from '@/lib/validations/certificate';
import { filteredIds, standingsInOrder, toDeskEnrollment } from '@/lib/desk/enrollments';
import { rosterCsv } from '@/lib/desk/roster-csv';
import { parseOrThrow, route } from '@/lib/errors';
import { isoDay } from '@/lib/local-time';
import { getProgramIdentity } from '@/lib/program/settings';

const IdsSchema = z
  .string()
  .regex(/^\d+(,\d+)*$/, 'a comma-separated list of enrollment ids')
  .transform((s) => s.split(',').map(Number))
  .refine((ids) => ids.length <= 5000, 'at most 5000 ids')
  .optional();

/** GET /api/desk/roster?ids=1,2 or ?course=&workshop=&status=&eligible= — the roster as a CSV file. */
export const GET = route(async (request) => {
  await requireRole('coordinator');
  const search = Object.fromEntries(new URL(request.url).searchParams);
  const { ids: idParam, ...rest } = search;
  const ids = parseOrThrow(IdsSchema, idParam, 'ids');
  const filter = parseOrThrow(DeskFilterSchema, rest, 'filters');
  const now = new Date();
  const chosen = ids ?? (await filteredIds(filter, now));
  const rows = (await standingsInOrder(chosen, now)).map((s) => toDeskEnrollment(s, now));
  const csv = rosterCsv(rows);
  // The file is named for the program's day, not UTC's.
  const stamp = isoDay(now, (await getProgramIdentity()).timeZone);
  return new Response(csv, {
    headers: {
      'Content-Type': 'text/csv; charset=utf-8',
      'Content-Disposition': `attachment; filename="brinewright-roster-${stamp}.csv"`,
      'Cache-Control': 'no-store',
    },
  });
});

import { requireRole } from '@/lib/auth/guard';
import { saveWorkshop } from '@/lib/enrollment/admin';
import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { WorkshopSchema } from '@/lib/validations/workshop';

/** POST /api/desk/workshops { courseId, date, startTime, endTime, timeZone, place, seats, instructorId, attendanceRequired } — a new workshop. */
export const POST = route(async (request) => {
  const user = await requireRole('coordinator');
  const values = parseOrThrow(WorkshopSchema, await readJson(request));
  return Response.json({ id: await saveWorkshop({ values, actorId: user.id }) }, { status: 201 });
});

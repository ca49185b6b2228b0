import { requireRole } from '@/lib/auth/guard';
import { markAttendance } from '@/lib/enrollment/admin';
import { AppError, parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { AttendanceSchema } from '@/lib/validations/workshop';

// The workshop's instructor (or a coordinator) marks a learner present, or clears the mark.
export const POST = route<{ params: Promise<{ id: string }> }>(async (request, { params }) => {
  const user = await requireRole('instructor');
  const id = Number((await params).id);
  if (!Number.isInteger(id) || id <= 0) throw new AppError('bad_request', 'That enrollment number is not valid.', { fields: { id: ['not a number'] } });
  const body = await readJson(request);
  const input = parseOrThrow(AttendanceSchema, { ...(body as object), enrollmentId: id }, 'attendance');
  const attendedAt = await markAttendance({ enrollmentId: input.enrollmentId, attended: input.attended, actor: user });
  return Response.json({ attendedAt: attendedAt?.toISOString() ?? null });
});

import { requireRole } from '@/lib/auth/guard';
import { clientAddress } from '@/lib/auth/options';
import { enrollInWorkshop } from '@/lib/enrollment/enroll';
import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { EnrollSchema } from '@/lib/validations/enrollment';

// A learner takes a seat: answers the checkout page's address, or (with a waiver) the confirmation page.
export const POST = route(async (request) => {
  const user = await requireRole('learner');
  const input = parseOrThrow(EnrollSchema, await readJson(request), 'enrollment');
  const result = await enrollInWorkshop({ user, workshopId: input.workshopId, waiverCode: input.waiverCode, address: clientAddress(request.headers) });
  return Response.json(result, { status: 201 });
});

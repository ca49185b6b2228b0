import { requireRole } from '@/lib/auth/guard';
import { saveWorkshop } from '@/lib/enrollment/admin';
import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { WorkshopIdSchema, WorkshopSchema } from '@/lib/validations/workshop';

/** POST /api/desk/workshops/:id — the workshop's new values (the same body as a new one); seats never below those taken. */
export const POST = route<{ params: Promise<{ id: string }> }>(async (request, { params }) => {
  const user = await requireRole('coordinator');
  const id = parseOrThrow(WorkshopIdSchema, (await params).id, 'workshop id');
  const values = parseOrThrow(WorkshopSchema, await readJson(request));
  return Response.json({ id: await saveWorkshop({ id, values, actorId: user.id }) });
});

import { requireRole } from '@/lib/auth/guard';
import { fetchWaivers } from '@/lib/enrollment/queries';
import { createWaiver } from '@/lib/enrollment/waivers';
import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { WaiverSchema } from '@/lib/validations/waiver';

export const GET = route(async () => {
  await requireRole('coordinator');
  return Response.json({ waivers: await fetchWaivers() });
});

// Coordinator: a new fee waiver code with a number of uses and a last day.
export const POST = route(async (request) => {
  const user = await requireRole('coordinator');
  const input = parseOrThrow(WaiverSchema, await readJson(request), 'waiver');
  const waiver = await createWaiver(input, user.id);
  return Response.json(
    { waiver: { id: waiver.id, code: waiver.code, maxUses: waiver.maxUses, uses: waiver.uses, expiresAt: waiver.expiresAt.toISOString() } },
    { status: 201 },
  );
});

import { z } from 'zod';
import { requireRole } from '@/lib/auth/guard';
import { reissueCertificate } from '@/lib/certificates/issue';
import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { ReissueSchema } from '@/lib/validations/certificate';

const IdSchema = z.coerce.number().int().positive();

/** POST /api/desk/certificates/:id/reissue { reason, holderName? } — a correction: a new serial, the old one shown as replaced. */
export const POST = route<{ params: Promise<{ id: string }> }>(async (request, { params }) => {
  const user = await requireRole('coordinator');
  const id = parseOrThrow(IdSchema, (await params).id, 'certificate id');
  const input = parseOrThrow(ReissueSchema, await readJson(request));
  return Response.json({ certificate: await reissueCertificate(id, user.id, input) });
});

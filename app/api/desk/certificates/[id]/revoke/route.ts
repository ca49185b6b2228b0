import { z } from 'zod';
import { requireRole } from '@/lib/auth/guard';
import { revokeCertificate } from '@/lib/certificates/issue';
import { RevokeSchema } from '@/lib/validations/certificate';
import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';

const IdSchema = z.coerce.number().int().positive();

/** POST /api/desk/certificates/:id/revoke { reason } — revokes once; 409 when already revoked. */
export const POST = route<{ params: Promise<{ id: string }> }>(async (request, { params }) => {
  const user = await requireRole('coordinator');
  const id = parseOrThrow(IdSchema, (await params).id, 'certificate id');
  const { reason } = parseOrThrow(RevokeSchema, await readJson(request));
  const revoked = await revokeCertificate(id, user.id, reason);
  return Response.json({ certificate: { ...revoked, revokedAt: revoked.revokedAt.toISOString() } });
});

import { requireRole } from '@/lib/auth/guard';
import { claimRefresherCertificate } from '@/lib/certificates/issue';
import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { RefresherClaimSchema } from '@/lib/validations/certificate';

/** POST /api/certificates/refresher { enrollmentId } — a learner who completed the refresher gets its certificate. */
export const POST = route(async (request) => {
  const user = await requireRole('learner');
  const { enrollmentId } = parseOrThrow(RefresherClaimSchema, await readJson(request));
  const outcome = await claimRefresherCertificate(enrollmentId, user.id);
  return Response.json(outcome, { status: outcome.outcome === 'issued' ? 201 : 200 });
});

import { requireRole } from '@/lib/auth/guard';
import { issueCertificates } from '@/lib/certificates/issue';
import { IssueSchema } from '@/lib/validations/certificate';
import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';

/**
 * POST /api/desk/certificates { enrollmentIds } — issues a certificate for each eligible one.
 * Answers every outcome (issued, exists, not_eligible with what is missing, not_found); the desk
 * sends a large selection in small batches to move its progress bar.
 */
export const POST = route(async (request) => {
  const user = await requireRole('coordinator');
  const { enrollmentIds } = parseOrThrow(IssueSchema, await readJson(request));
  const results = await issueCertificates(enrollmentIds, user.id);
  const count = (o: string) => results.filter((r) => r.outcome === o).length;
  return Response.json({ results, issued: count('issued'), existing: count('exists'), notEligible: count('not_eligible'), notFound: count('not_found') });
});

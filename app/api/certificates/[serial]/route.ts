import { clientAddress } from '@/lib/auth/options';
import { verifyForAddress } from '@/lib/certificates/lookup';
import { SerialParamSchema } from '@/lib/validations/certificate';
import { AppError, decodeParam, parseOrThrow, route } from '@/lib/errors';

export const dynamic = 'force-dynamic';

/**
 * GET /api/certificates/:serial — the public check for other systems. 200 with
 * { serial, state: valid|expired|revoked, learnerName, courseTitle, programName, issuedAt, validUntil, revokedAt,
 *   replaced: { at, bySerial } | null } (what the certificate said when issued; `replaced` for a serial a reissue corrected);
 * 404 for an unknown serial, 400 for one that is malformed (wrong length or check character),
 * 429 with Retry-After when the address checks too often.
 */
export const GET = route<{ params: Promise<{ serial: string }> }>(async (request, { params }) => {
  const serial = parseOrThrow(SerialParamSchema, decodeParam((await params).serial), 'serial');
  const address = clientAddress(request.headers);
  try {
    const result = await verifyForAddress(serial, address);
    if (!result.found && result.reason === 'malformed') {
      throw new AppError('bad_request', 'That is not a Brinewright certificate serial: check the 16 characters again.', {
        fields: { serial: ['malformed or wrong check character'] },
      });
    }
    if (!result.found) throw new AppError('not_found', 'No certificate has that serial.');
    return Response.json(result, { headers: { 'Cache-Control': 'no-store' } });
  } catch (error) {
    if (error instanceof AppError && error.type === 'rate_limit') {
      return error.toResponse({ headers: { 'Retry-After': String(error.extra?.retryAfterSeconds ?? 60) } });
    }
    throw error;
  }
});

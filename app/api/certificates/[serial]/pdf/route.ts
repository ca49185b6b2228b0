import { requireRole } from '@/lib/auth/guard';
import { certificatePdfFor } from '@/lib/certificates/lookup';
import { SerialParamSchema } from '@/lib/validations/certificate';
import { decodeParam, parseOrThrow, route } from '@/lib/errors';

export const dynamic = 'force-dynamic';

/** GET /api/certificates/:serial/pdf — the certificate PDF for its owner, a coordinator or an admin. */
export const GET = route<{ params: Promise<{ serial: string }> }>(async (_request, { params }) => {
  const viewer = await requireRole();
  const serial = parseOrThrow(SerialParamSchema, decodeParam((await params).serial), 'serial');
  const { serial: canonical, pdf } = await certificatePdfFor(serial, viewer);
  return new Response(Buffer.from(pdf), {
    headers: {
      'Content-Type': 'application/pdf',
      'Content-Disposition': `attachment; filename="certificate-${canonical}.pdf"`,
      'Cache-Control': 'private, no-store',
    },
  });
});

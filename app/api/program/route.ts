import { getProgramIdentity } from '@/lib/program/settings';
import { route } from '@/lib/errors';

export const dynamic = 'force-dynamic';

/** GET /api/program — the program's public identity for the header (name, short name, contact, whether a logo exists). */
export const GET = route(async () => {
  const p = await getProgramIdentity();
  return Response.json(
    {
      name: p.name,
      shortName: p.shortName,
      contactEmail: p.contactEmail,
      contactPhone: p.contactPhone,
      logo: p.logoKey ? `/api/program/logo?v=${p.logoKey.slice(-24, -4)}` : null,
    },
    // Not cached: the header must show a saved change on the next page.
    { headers: { 'Cache-Control': 'no-cache' } },
  );
});

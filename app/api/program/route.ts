import { requireRole } from '@/lib/auth/guard';
import { parseOrThrow, route } from '@/lib/errors';
import { getProgramIdentity, saveProgramSettings } from '@/lib/program/settings';
import { readJson } from '@/lib/server/body';
import { ProgramSettingsSchema } from '@/lib/validations/program';

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

/** POST /api/program { name, shortName, contactEmail?, contactPhone?, postalAddress?, timeZone } — the admin's program page. */
export const POST = route(async (request) => {
  const actor = await requireRole('admin');
  const input = parseOrThrow(ProgramSettingsSchema, await readJson(request));
  await saveProgramSettings(actor.id, input);
  return Response.json({ ok: true });
});

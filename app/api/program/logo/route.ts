import fs from 'node:fs/promises';
import path from 'node:path';
import { requireRole } from '@/lib/auth/guard';
import { route } from '@/lib/errors';
import { MAX_LOGO_BYTES } from '@/lib/program/logo';
import { readProgramLogo, saveProgramLogo } from '@/lib/program/settings';
import { readFileForm } from '@/lib/server/upload';

export const dynamic = 'force-dynamic';

/** GET /api/program/logo — the program's logo (a PNG this app re-encoded), public; Brinewright's own icon until one is uploaded. */
export const GET = route(async () => {
  const logo = (await readProgramLogo())?.data ?? (await fs.readFile(path.join(process.cwd(), 'public/icons/icon-192.png')));
  return new Response(new Uint8Array(logo), { headers: { 'Content-Type': 'image/png', 'Cache-Control': 'public, max-age=300' } });
});

/** POST /api/program/logo (multipart, field "logo") — a new logo, re-encoded as a PNG; the admin's program page sends it after the fields. */
export const POST = route(async (request) => {
  const actor = await requireRole('admin');
  const { file } = await readFileForm(request, {
    field: 'logo',
    maxBytes: MAX_LOGO_BYTES,
    tooLarge: 'That logo is larger than 900 KB. Save a smaller PNG, JPEG or WebP.',
    missing: 'Choose a logo to upload.',
  });
  const { logoKey } = await saveProgramLogo(actor.id, file);
  return Response.json({ logo: `/api/program/logo?v=${logoKey.slice(-24, -4)}` }, { status: 201 });
});

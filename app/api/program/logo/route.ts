import fs from 'node:fs/promises';
import path from 'node:path';
import { route } from '@/lib/errors';
import { readProgramLogo } from '@/lib/program/settings';

export const dynamic = 'force-dynamic';

/** GET /api/program/logo — the program's logo (a PNG this app re-encoded), public; Brinewright's own icon until one is uploaded. */
export const GET = route(async () => {
  const logo = (await readProgramLogo())?.data ?? (await fs.readFile(path.join(process.cwd(), 'public/icons/icon-192.png')));
  return new Response(new Uint8Array(logo), { headers: { 'Content-Type': 'image/png', 'Cache-Control': 'public, max-age=300' } });
});

import { requireRole } from '@/lib/auth/guard';
import { parseOrThrow, route } from '@/lib/errors';
import { importHolders } from '@/lib/import/holders';
import { IMPORT_BODY_LIMIT, readJson } from '@/lib/server/body';
import { HolderImportSchema } from '@/lib/validations/holder-import';

/** POST /api/desk/import { text } — imports the file (checked again now) in one transaction, or nothing (422 with the preview when a line is refused). */
export const POST = route(async (request) => {
  const actor = await requireRole('coordinator');
  const { text } = parseOrThrow(HolderImportSchema, await readJson(request, IMPORT_BODY_LIMIT));
  return Response.json({ preview: await importHolders(text, actor.id) }, { status: 201 });
});

import { requireRole } from '@/lib/auth/guard';
import { parseOrThrow, route } from '@/lib/errors';
import { previewHolderImport } from '@/lib/import/holders';
import { IMPORT_BODY_LIMIT, readJson } from '@/lib/server/body';
import { HolderImportSchema } from '@/lib/validations/holder-import';

/** POST /api/desk/import/preview { text } — what importing the CSV file would do, line by line; writes nothing. */
export const POST = route(async (request) => {
  await requireRole('coordinator');
  const { text } = parseOrThrow(HolderImportSchema, await readJson(request, IMPORT_BODY_LIMIT));
  return Response.json({ preview: await previewHolderImport(text) });
});

'use server';

import { requireRole } from '@/lib/auth/guard';
import { AppError } from '@/lib/errors';
import { importHolders, previewHolderImport, type ImportPreview } from '@/lib/import/holders';

export type State = { step: 'upload' | 'preview' | 'done'; message?: string; preview?: ImportPreview; text?: string };

async function fileText(formData: FormData): Promise<string | null> {
  const file = formData.get('file');
  if (file && typeof file !== 'string' && file.size > 0) return file.text();
  const text = formData.get('text');
  return typeof text === 'string' && text.length > 0 ? text : null;
}

/** Reads the uploaded file and shows what importing it would do, line by line; writes nothing. */
export async function previewImportAction(_prev: State, formData: FormData): Promise<State> {
  await requireRole('coordinator');
  const text = await fileText(formData);
  if (!text) return { step: 'upload', message: 'Choose a CSV file to preview.' };
  try {
    return { step: 'preview', preview: await previewHolderImport(text), text };
  } catch (error) {
    if (error instanceof AppError) return { step: 'upload', message: error.message };
    throw error;
  }
}

/** Imports the previewed file (checked again now) in one transaction, or nothing. */
export async function importAction(_prev: State, formData: FormData): Promise<State> {
  const actor = await requireRole('coordinator');
  const text = await fileText(formData);
  if (!text) return { step: 'upload', message: 'Choose a CSV file to preview.' };
  try {
    const preview = await importHolders(text, actor.id);
    return { step: 'done', preview, message: `Imported ${preview.counts.create} certificate(s); ${preview.counts.skip} line(s) skipped as duplicates.` };
  } catch (error) {
    if (error instanceof AppError)
      return { step: 'preview', message: error.message, preview: (error.extra?.preview as ImportPreview | undefined) ?? undefined, text };
    throw error;
  }
}

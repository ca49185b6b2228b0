import { AppError } from '@/lib/errors';
import { readBodyBytes } from '@/lib/server/body';

// Room for the multipart boundaries and the other small fields around the file.
const MULTIPART_OVERHEAD = 64 * 1024;

export type FileFormOptions = {
  /** The form field that carries the file. */
  field: string;
  maxBytes: number;
  /** The sentence for a file (or body) over the limit (413). */
  tooLarge: string;
  /** The sentence when the field holds no file (400, on the field). */
  missing: string;
};

/**
 * Reads a multipart upload with at most one file without ever holding more than the limit in
 * memory: a declared or actual body beyond the limit (plus the form's overhead) is a 413 at once.
 */
export async function readFileForm(
  request: Request,
  { field, maxBytes, tooLarge, missing }: FileFormOptions,
): Promise<{ file: Buffer; fields: Record<string, string> }> {
  const type = request.headers.get('content-type') ?? '';
  if (!type.toLowerCase().startsWith('multipart/form-data')) throw new AppError('bad_request', `Send the file as multipart/form-data with a "${field}" field.`);
  const body = await readBodyBytes(request, maxBytes + MULTIPART_OVERHEAD, tooLarge);
  if (!body) throw new AppError('bad_request', 'The upload is empty.');
  let form: FormData;
  try {
    form = await new Response(body as BodyInit, { headers: { 'content-type': type } }).formData();
  } catch {
    throw new AppError('bad_request', 'The upload could not be read as a form.');
  }
  const file = form.get(field);
  if (!file || typeof file === 'string') throw new AppError('bad_request', missing, { fields: { [field]: [missing] } });
  if (file.size > maxBytes) throw new AppError('too_large', tooLarge);
  const fields: Record<string, string> = {};
  for (const [key, value] of form.entries()) if (typeof value === 'string') fields[key] = value;
  return { file: Buffer.from(await file.arrayBuffer()), fields };
}

import { AppError } from '@/lib/errors';
import { readBodyBytes } from '@/lib/server/body';
import { MAX_PHOTO_BYTES } from './images';

// Room for the multipart boundaries and the other small fields around the photo.
const MULTIPART_OVERHEAD = 64 * 1024;
export const TOO_LARGE_MESSAGE = 'That photo is larger than 10 MB. Choose a smaller one or lower the camera resolution.';

/**
 * Reads a multipart upload with at most one photo without ever holding more than the limit in
 * memory: a declared or actual body beyond 10 MB (plus the form's overhead) is a 413 at once.
 */
export async function readPhotoForm(request: Request): Promise<{ file: Buffer; fields: Record<string, string> }> {
  const type = request.headers.get('content-type') ?? '';
  if (!type.toLowerCase().startsWith('multipart/form-data')) throw new AppError('bad_request', 'Send the photo as multipart/form-data with a "photo" field.');
  const body = await readBodyBytes(request, MAX_PHOTO_BYTES + MULTIPART_OVERHEAD, TOO_LARGE_MESSAGE);
  if (!body) throw new AppError('bad_request', 'The upload is empty.');
  let form: FormData;
  try {
    form = await new Response(body as BodyInit, { headers: { 'content-type': type } }).formData();
  } catch {
    throw new AppError('bad_request', 'The upload could not be read as a form.');
  }
  const photo = form.get('photo');
  if (!photo || typeof photo === 'string') throw new AppError('bad_request', 'Choose a photo to upload.', { fields: { photo: ['Choose a photo to upload.'] } });
  if (photo.size > MAX_PHOTO_BYTES) throw new AppError('too_large', TOO_LARGE_MESSAGE);
  const fields: Record<string, string> = {};
  for (const [key, value] of form.entries()) if (typeof value === 'string') fields[key] = value;
  return { file: Buffer.from(await photo.arrayBuffer()), fields };
}

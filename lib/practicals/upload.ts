import { AppError } from '@/lib/errors';
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
  const limit = MAX_PHOTO_BYTES + MULTIPART_OVERHEAD;
  const declared = Number(request.headers.get('content-length') ?? '0');
  if (declared > limit) throw new AppError('too_large', TOO_LARGE_MESSAGE);
  if (!request.body) throw new AppError('bad_request', 'The upload is empty.');
  const chunks: Uint8Array[] = [];
  let size = 0;
  const reader = request.body.getReader();
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      await reader.cancel().catch(() => undefined);
      throw new AppError('too_large', TOO_LARGE_MESSAGE);
    }
    chunks.push(value);
  }
  let form: FormData;
  try {
    form = await new Response(Buffer.concat(chunks), { headers: { 'content-type': type } }).formData();
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

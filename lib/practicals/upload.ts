import { readFileForm } from '@/lib/server/upload';
import { MAX_PHOTO_BYTES } from './images';

export const TOO_LARGE_MESSAGE = 'That photo is larger than 10 MB. Choose a smaller one or lower the camera resolution.';

/** A multipart upload with one photo of at most 10 MB (413 beyond it, before the rest is read). */
export function readPhotoForm(request: Request): Promise<{ file: Buffer; fields: Record<string, string> }> {
  return readFileForm(request, { field: 'photo', maxBytes: MAX_PHOTO_BYTES, tooLarge: TOO_LARGE_MESSAGE, missing: 'Choose a photo to upload.' });
}

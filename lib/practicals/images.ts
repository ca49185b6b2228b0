import sharp from 'sharp';

export const MAX_PHOTO_BYTES = 10 * 1024 * 1024;
export const MAX_LONG_SIDE_PX = 2000;
export const THUMBNAIL_LONG_SIDE_PX = 320;
// A 10 MB file can hold a very large picture; refuse decompression bombs before decoding them.
const MAX_INPUT_PIXELS = 80_000_000;

export type PhotoFormat = 'jpeg' | 'png' | 'webp';

export class PhotoRejected extends Error {
  constructor(
    readonly reason: 'too-large' | 'unsupported' | 'unreadable',
    message: string,
  ) {
    super(message);
    this.name = 'PhotoRejected';
  }
}

/** The format from the file's first bytes (its signature), whatever its name or declared type says. */
export function sniffFormat(bytes: Uint8Array): PhotoFormat | null {
  const at = (offset: number, ...values: number[]) => values.every((v, i) => bytes[offset + i] === v);
  if (bytes.length >= 3 && at(0, 0xff, 0xd8, 0xff)) return 'jpeg';
  if (bytes.length >= 8 && at(0, 0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a)) return 'png';
  // RIFF....WEBP
  if (bytes.length >= 12 && at(0, 0x52, 0x49, 0x46, 0x46) && at(8, 0x57, 0x45, 0x42, 0x50)) return 'webp';
  return null;
}

export const UNSUPPORTED_MESSAGE = 'That file is not a JPEG, PNG or WebP photo. Take the picture again or save it as a JPEG, then try once more.';

export type ProcessedPhoto = {
  format: PhotoFormat;
  image: { data: Buffer; width: number; height: number; contentType: 'image/jpeg' };
  thumbnail: { data: Buffer; width: number; height: number; contentType: 'image/jpeg' };
};

/**
 * Checks a photo by its content and re-encodes it: turned upright from its orientation tag, every
 * piece of metadata (camera, time, location) dropped, at most 2000 px on the long side, plus a
 * thumbnail. Throws PhotoRejected for anything that is not a readable JPEG, PNG or WebP.
 */
export async function processPhoto(input: Buffer): Promise<ProcessedPhoto> {
  if (input.length > MAX_PHOTO_BYTES)
    throw new PhotoRejected('too-large', 'That photo is larger than 10 MB. Choose a smaller one or lower the camera resolution.');
  const format = sniffFormat(input);
  if (!format) throw new PhotoRejected('unsupported', UNSUPPORTED_MESSAGE);
  let metadataFormat: string | undefined;
  let hasAlpha = false;
  try {
    const metadata = await sharp(input, { limitInputPixels: MAX_INPUT_PIXELS }).metadata();
    metadataFormat = metadata.format;
    hasAlpha = Boolean(metadata.hasAlpha);
  } catch {
    throw new PhotoRejected('unreadable', 'That photo could not be read; the file may be damaged. Try saving it again.');
  }
  // The decoder must agree with the signature: a file that only starts like a photo is refused.
  if (metadataFormat !== format) throw new PhotoRejected('unsupported', UNSUPPORTED_MESSAGE);

  try {
    // .rotate() with no angle applies the orientation tag; sharp writes no metadata unless asked to.
    // One pipeline, so libjpeg can shrink on load; transparent PNG/WebP go onto white before JPEG.
    let pipeline = sharp(input, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'error' })
      .rotate()
      .resize({ width: MAX_LONG_SIDE_PX, height: MAX_LONG_SIDE_PX, fit: 'inside', withoutEnlargement: true });
    if (hasAlpha) pipeline = pipeline.flatten({ background: '#ffffff' });
    const image = await pipeline.jpeg({ quality: 82 }).toBuffer({ resolveWithObject: true });
    const thumbnail = await sharp(image.data)
      .resize({ width: THUMBNAIL_LONG_SIDE_PX, height: THUMBNAIL_LONG_SIDE_PX, fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: 75 })
      .toBuffer({ resolveWithObject: true });
    return {
      format,
      image: { data: image.data, width: image.info.width, height: image.info.height, contentType: 'image/jpeg' },
      thumbnail: { data: thumbnail.data, width: thumbnail.info.width, height: thumbnail.info.height, contentType: 'image/jpeg' },
    };
  } catch {
    throw new PhotoRejected('unreadable', 'That photo could not be read; the file may be damaged. Try saving it again.');
  }
}

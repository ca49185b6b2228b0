import sharp from 'sharp';
import { sniffFormat } from '@/lib/practicals/images';
import { AppError } from '@/lib/errors';

export const MAX_LOGO_BYTES = 900 * 1024;
export const LOGO_SIDE_PX = 256;

/**
 * Checks an uploaded logo by its content and re-encodes it as a PNG of at most 256 px a side with
 * no metadata, so what is served is always an image this app wrote.
 */
export async function processLogo(input: Buffer): Promise<Buffer> {
  if (input.length > MAX_LOGO_BYTES) throw new AppError('too_large', 'That logo is larger than 900 KB. Save a smaller PNG, JPEG or WebP.');
  const format = sniffFormat(input);
  if (!format) throw new AppError('bad_request', 'The logo must be a PNG, JPEG or WebP image.', { fields: { logo: ['Not a PNG, JPEG or WebP image.'] } });
  try {
    const meta = await sharp(input, { limitInputPixels: 40_000_000 }).metadata();
    if (meta.format !== format) throw new Error('signature and decoder disagree');
    return await sharp(input, { limitInputPixels: 40_000_000, failOn: 'error' })
      .rotate()
      .resize({ width: LOGO_SIDE_PX, height: LOGO_SIDE_PX, fit: 'inside', withoutEnlargement: true })
      .png()
      .toBuffer();
  } catch {
    throw new AppError('bad_request', 'That logo could not be read; the file may be damaged.', { fields: { logo: ['The image could not be read.'] } });
  }
}

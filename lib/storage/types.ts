/** What the photo store needs from any backend: the disk now, an S3-compatible bucket later. */
export interface StorageDriver {
  /** A short name for logs and tests, e.g. 'disk' or 's3'. */
  readonly name: string;
  put(key: string, data: Buffer, contentType: string): Promise<void>;
  /** The stored bytes, or null when nothing is stored under the key. */
  get(key: string): Promise<{ data: Buffer; contentType: string } | null>;
  delete(key: string): Promise<void>;
}

// Keys are made by the app (never from user input), but a driver still refuses anything that
// could leave its folder or bucket prefix.
const KEY = /^[a-z0-9][a-z0-9/_-]{0,180}\.(jpg|png|webp)$/;

export function assertKey(key: string): void {
  if (!KEY.test(key) || key.includes('..') || key.includes('//')) throw new Error(`Invalid storage key: ${key}`);
}

export const CONTENT_TYPES: Record<string, string> = { jpg: 'image/jpeg', png: 'image/png', webp: 'image/webp' };

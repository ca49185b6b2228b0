import path from 'node:path';
import { getEnv, type Env } from '@/lib/env';
import { diskDriver } from './disk';
import { s3Driver } from './s3';
import type { StorageDriver } from './types';

export type { StorageDriver } from './types';
export { diskDriver } from './disk';
export { s3Driver } from './s3';

// The one storage module for photos: the disk inside the ignored data folder by default, or an
// S3-compatible bucket (STORAGE_DRIVER=s3) when several app servers share the load. The choice is
// read from the environment when the server first needs it, never at build time.
let current: StorageDriver | undefined;

export function defaultPhotoRoot(): string {
  return path.join(process.cwd(), '.data', 'photos');
}

/** The driver a configuration asks for. */
export function storageFromEnv(
  env: Pick<Env, 'STORAGE_DRIVER' | 'S3_ENDPOINT' | 'S3_REGION' | 'S3_BUCKET' | 'S3_ACCESS_KEY_ID' | 'S3_SECRET_ACCESS_KEY' | 'S3_FORCE_PATH_STYLE'>,
): StorageDriver {
  if (env.STORAGE_DRIVER !== 's3') return diskDriver(defaultPhotoRoot());
  // lib/env.ts has already refused an s3 configuration without these.
  return s3Driver({
    bucket: env.S3_BUCKET!,
    region: env.S3_REGION,
    accessKeyId: env.S3_ACCESS_KEY_ID!,
    secretAccessKey: env.S3_SECRET_ACCESS_KEY!,
    endpoint: env.S3_ENDPOINT,
    forcePathStyle: env.S3_FORCE_PATH_STYLE,
  });
}

export function getStorage(): StorageDriver {
  current ??= storageFromEnv(getEnv());
  return current;
}

/** Swaps the driver (tests and the benchmark use a folder of their own). */
export function setStorage(driver: StorageDriver | undefined): void {
  current = driver;
}

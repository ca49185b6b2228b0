import path from 'node:path';
import { diskDriver } from './disk';
import type { StorageDriver } from './types';

export type { StorageDriver } from './types';
export { diskDriver } from './disk';

// The one storage module for photos. Today it is the disk inside the ignored data folder; an
// S3-compatible driver implementing StorageDriver can be returned here when several app servers
// share the load.
let current: StorageDriver | undefined;

export function defaultPhotoRoot(): string {
  return path.join(process.cwd(), '.data', 'photos');
}

export function getStorage(): StorageDriver {
  current ??= diskDriver(defaultPhotoRoot());
  return current;
}

/** Swaps the driver (tests and the benchmark use a folder of their own). */
export function setStorage(driver: StorageDriver | undefined): void {
  current = driver;
}

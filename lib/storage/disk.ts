import { promises as fs } from 'node:fs';
import path from 'node:path';
import { assertKey, CONTENT_TYPES, type StorageDriver } from './types';

/** Stores each object as a file under `root` (by default .data/photos, which git ignores). */
export function diskDriver(root: string): StorageDriver {
  const fileFor = (key: string) => {
    assertKey(key);
    const file = path.resolve(root, key);
    if (!file.startsWith(path.resolve(root) + path.sep)) throw new Error(`Invalid storage key: ${key}`);
    return file;
  };
  return {
    name: 'disk',
    async put(key, data) {
      const file = fileFor(key);
      await fs.mkdir(path.dirname(file), { recursive: true });
      // Write then rename, so a reader never sees half a photo.
      const temporary = `${file}.${process.pid}.${Date.now()}.part`;
      await fs.writeFile(temporary, data);
      await fs.rename(temporary, file);
    },
    async get(key) {
      const file = fileFor(key);
      try {
        const data = await fs.readFile(file);
        return { data, contentType: CONTENT_TYPES[path.extname(file).slice(1)] ?? 'application/octet-stream' };
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code === 'ENOENT') return null;
        throw error;
      }
    },
    async delete(key) {
      await fs.rm(fileFor(key), { force: true });
    },
  };
}

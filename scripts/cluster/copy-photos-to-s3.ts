// Copies the photos kept by the disk driver (.data/photos, or the folder given) into the S3 bucket
// the environment configures (STORAGE_DRIVER=s3, S3_*), under the same keys, so the rows in
// practical_photos find them after the switch. Objects already in the bucket are left alone, so it
// can run again. `npm run demo:cluster` runs it for the demo seed's photos; a real move from one
// server to several does the same once, before the app servers start with STORAGE_DRIVER=s3.
//   tsx scripts/cluster/copy-photos-to-s3.ts [FOLDER]
import { promises as fs } from 'node:fs';
import path from 'node:path';
import { parseEnv } from '../../lib/env';
import { defaultPhotoRoot, storageFromEnv } from '../../lib/storage';
import { assertKey, CONTENT_TYPES } from '../../lib/storage/types';

async function* files(dir: string): AsyncGenerator<string> {
  let entries;
  try {
    entries = await fs.readdir(dir, { withFileTypes: true });
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return;
    throw error;
  }
  for (const entry of entries) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) yield* files(full);
    else if (entry.isFile()) yield full;
  }
}

async function main() {
  const env = parseEnv({ NEXTAUTH_SECRET: 'not-used-by-this-script', DATABASE_URL: 'mariadb://not-used@127.0.0.1/not_used', ...process.env });
  if (env.STORAGE_DRIVER !== 's3') throw new Error('STORAGE_DRIVER is not s3: nothing to copy to');
  const storage = storageFromEnv(env);
  const root = path.resolve(process.argv[2] ?? defaultPhotoRoot());
  let copied = 0;
  let present = 0;
  let skipped = 0;
  for await (const file of files(root)) {
    const key = path.relative(root, file).split(path.sep).join('/');
    try {
      assertKey(key);
    } catch {
      skipped++; // half-written .part files and anything else that is not a photo key
      continue;
    }
    if (await storage.get(key)) {
      present++;
      continue;
    }
    await storage.put(key, await fs.readFile(file), CONTENT_TYPES[path.extname(key).slice(1)] ?? 'application/octet-stream');
    copied++;
  }
  console.log(`[photos] ${copied} copied to bucket ${env.S3_BUCKET}, ${present} already there, ${skipped} skipped (from ${root})`);
}

main().catch((error) => {
  console.error(`[photos] ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});

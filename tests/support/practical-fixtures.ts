import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp, { type Sharp } from 'sharp';
import { afterAll, beforeAll, beforeEach } from 'vitest';
import type { SessionUser } from '@/lib/auth/users';
import { diskDriver, setStorage } from '@/lib/storage';
import type { PracticalForm } from '@/lib/validations/practical';
import { db } from '@/models';
import { createCourses, createUser, resetDatabase } from './db';
import { actAs } from './session';

// Shared set-up for the practical and photo tests: a photo folder of their own, an enrolled learner.

export function useTemporaryStorage(): { root: string; files: () => string[]; cleanup: () => void } {
  const root = fs.mkdtempSync(path.join(os.tmpdir(), 'brinewright-photos-'));
  setStorage(diskDriver(root));
  const files = () =>
    fs.existsSync(root) ? (fs.readdirSync(root, { recursive: true }) as string[]).filter((f) => fs.statSync(path.join(root, f)).isFile()) : [];
  return {
    root,
    files,
    cleanup: () => {
      setStorage(undefined);
      fs.rmSync(root, { recursive: true, force: true });
    },
  };
}

let quick = 0;
// A learner row without a bcrypt round (they never sign in), for tests that need many.
async function quickLearner(): Promise<SessionUser> {
  quick += 1;
  const user = await db().User.create({
    email: `bulk${quick}-${Date.now()}@test.example`,
    name: `Bulk learner ${quick}`,
    roles: ['learner'],
    passwordHash: 'not-a-login',
    emailVerifiedAt: new Date(),
  });
  return { id: user.id, email: user.email, name: user.name, roles: user.roles };
}

export async function enrolledLearner(
  courseId: number,
  status: 'active' | 'completed' | 'withdrawn' | 'awaiting_payment' = 'active',
  workshopId: number | null = null,
  options: { quick?: boolean } = {},
) {
  const learner = options.quick ? await quickLearner() : await createUser('learner');
  const enrollment = await db().Enrollment.create({
    userId: learner.id,
    courseId,
    workshopId,
    runKey: workshopId ? String(workshopId) : 'self-paced',
    status,
    feeCents: 4500,
  });
  return { learner, enrollment };
}

export async function catalog() {
  const { flagship, refresher } = await createCourses();
  const instructor = await createUser('instructor');
  const workshop = await db().Workshop.create({
    courseId: flagship.id,
    instructorId: instructor.id,
    startsAt: new Date('2026-12-15T16:00:00Z'),
    endsAt: new Date('2026-12-15T21:00:00Z'),
    timeZone: 'America/Denver',
    place: 'Cedar Hollow Grange Hall, 14 Mill Road',
    seats: 12,
  });
  return { flagship, refresher, instructor, workshop };
}

/** A real JPEG, made here, with a colour gradient so it is not trivially compressible. */
export async function makeJpeg(width = 640, height = 480, extra: (s: Sharp) => Sharp = (s) => s): Promise<Buffer> {
  const raw = Buffer.alloc(width * height * 3);
  for (let y = 0; y < height; y++) for (let x = 0; x < width; x++) raw.set([(x * 255) / width, (y * 255) / height, 96], (y * width + x) * 3);
  return extra(sharp(raw, { raw: { width, height, channels: 3 } }).jpeg({ quality: 85 })).toBuffer();
}

export function photoRequest(file: Buffer, filename: string, type: string, course = 'pickling-and-canning'): Request {
  const form = new FormData();
  form.set('course', course);
  form.set('photo', new File([new Uint8Array(file)], filename, { type }));
  return new Request('http://localhost:3000/api/photos', { method: 'POST', body: form });
}

export const GOOD_BATCH = (photoIds: number[]): PracticalForm => ({
  product: 'fresh-pack-dill-pickles',
  recipeTitle: 'Quick fresh-pack dill pickles',
  recipeSource: 'USDA Complete Guide to Home Canning (2015), Guide 6',
  jar: 'pint',
  jars: 7,
  pack: 'raw',
  vinegarAcidityPct: 5,
  vinegarMl: 1420,
  waterMl: 1890,
  headspaceIn: 0.5,
  method: 'boiling-water',
  altitudeFt: 5200,
  minutes: 15,
  batchDate: '2026-11-28',
  sealedJars: 7,
  unsealedJars: 0,
  notes: '',
  photoIds,
});

export type { SessionUser };

/** The hooks a practical test file needs: its own photo folder, then per test a clean database, nobody signed in and the catalog. */
export function practicalSetting(): { readonly current: Awaited<ReturnType<typeof catalog>>; readonly storage: ReturnType<typeof useTemporaryStorage> } {
  let storage: ReturnType<typeof useTemporaryStorage>;
  let current: Awaited<ReturnType<typeof catalog>>;
  beforeAll(() => {
    storage = useTemporaryStorage();
  });
  afterAll(() => storage.cleanup());
  beforeEach(async () => {
    await resetDatabase();
    actAs(null);
    current = await catalog();
  });
  return {
    get current() {
      return current;
    },
    get storage() {
      return storage;
    },
  };
}

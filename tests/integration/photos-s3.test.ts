import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { GET as getPhoto } from '@/app/api/photos/[id]/route';
import { POST as uploadPhoto } from '@/app/api/photos/route';
import { startFakeS3, type FakeS3 } from '@/fakes/s3/server';
import { s3Driver, setStorage } from '@/lib/storage';
import { db } from '@/models';
import { resetDatabase } from '../support/db';
import { params } from '../support/request';
import { actAs } from '../support/session';
import { catalog, enrolledLearner, makeJpeg, photoRequest } from '../support/practical-fixtures';

// The practical photo routes with the S3 driver (STORAGE_DRIVER=s3) against the local fake: the
// same answers as on disk, and a store outage answered 503 with nothing half-stored.
const ACCESS_KEY = 'BRINEWRIGHTINTKEY001';
const SECRET = 'integration-s3-secret-0123456789abcdef';
const BUCKET = 'brinewright-int-photos';

let folder: string;
let fake: FakeS3 | undefined;
let port: number;
const start = async () => {
  fake = await startFakeS3({ root: path.join(folder, 's3'), port, accessKeyId: ACCESS_KEY, secretAccessKey: SECRET, buckets: [BUCKET] });
  port = fake.port;
};

beforeAll(async () => {
  folder = fs.mkdtempSync(path.join(os.tmpdir(), 'brinewright-photos-s3-'));
  port = 0;
  await start();
  setStorage(s3Driver({ bucket: BUCKET, region: 'us-east-1', accessKeyId: ACCESS_KEY, secretAccessKey: SECRET, endpoint: fake!.url, forcePathStyle: true }));
});
afterAll(async () => {
  setStorage(undefined);
  await fake?.close();
  fs.rmSync(folder, { recursive: true, force: true });
});
beforeEach(async () => {
  await resetDatabase();
  actAs(null);
  if (!fake) await start();
});

const objectFile = (key: string) => path.join(folder, 's3', BUCKET, 'objects', ...key.split('/'));

describe('practical photos in an S3 bucket', () => {
  it('stores the re-encoded photo and its thumbnail in the bucket and serves them back to the owner', async () => {
    const setting = await catalog();
    const { learner } = await enrolledLearner(setting.flagship.id);
    actAs(learner);
    const response = await uploadPhoto(photoRequest(await makeJpeg(800, 600), 'jars.jpg', 'image/jpeg'), {});
    expect(response.status).toBe(201);
    const { photo } = await response.json();
    const row = (await db().PracticalPhoto.findByPk(photo.id))!;
    expect(fs.existsSync(objectFile(row.storageKey))).toBe(true);
    expect(fs.existsSync(objectFile(row.thumbnailKey))).toBe(true);

    const full = await getPhoto(new Request(`http://localhost:3000/api/photos/${photo.id}`), params({ id: String(photo.id) }));
    expect(full.status).toBe(200);
    expect(full.headers.get('content-type')).toBe('image/jpeg');
    expect(Buffer.from(await full.arrayBuffer()).equals(fs.readFileSync(objectFile(row.storageKey)))).toBe(true);
    const thumb = await getPhoto(new Request(`http://localhost:3000/api/photos/${photo.id}?size=thumb`), params({ id: String(photo.id) }));
    expect(Buffer.from(await thumb.arrayBuffer()).equals(fs.readFileSync(objectFile(row.thumbnailKey)))).toBe(true);
  });

  it('answers 503 while the store is down (no row, nothing stored) and serves again once it is back', async () => {
    const setting = await catalog();
    const { learner } = await enrolledLearner(setting.flagship.id);
    actAs(learner);
    const before = await uploadPhoto(photoRequest(await makeJpeg(400, 300), 'before.jpg', 'image/jpeg'), {});
    const { photo } = await before.json();

    const listObjects = () =>
      fs
        .readdirSync(path.join(folder, 's3', BUCKET, 'objects'), { recursive: true })
        .map(String)
        .sort();
    const stored = listObjects();
    await fake!.close();
    fake = undefined;
    const refused = await uploadPhoto(photoRequest(await makeJpeg(400, 300), 'during.jpg', 'image/jpeg'), {});
    expect(refused.status).toBe(503);
    expect((await refused.json()).message).toMatch(/photo store cannot be reached/);
    expect(await db().PracticalPhoto.count({ where: { userId: learner.id } })).toBe(1);
    const unavailable = await getPhoto(new Request(`http://localhost:3000/api/photos/${photo.id}`), params({ id: String(photo.id) }));
    expect(unavailable.status).toBe(503);

    await start(); // same port, same folder
    const served = await getPhoto(new Request(`http://localhost:3000/api/photos/${photo.id}`), params({ id: String(photo.id) }));
    expect(served.status).toBe(200);
    expect(listObjects()).toEqual(stored); // the refused upload left nothing behind
  });
});

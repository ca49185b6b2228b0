import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { CreateBucketCommand, HeadBucketCommand, S3Client } from '@aws-sdk/client-s3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startFakeS3, type FakeS3 } from '@/fakes/s3/server';
import { parseEnv } from '@/lib/env';
import { diskDriver } from './disk';
import { storageFromEnv } from './index';
import { s3Driver, type S3DriverOptions } from './s3';
import type { StorageDriver } from './types';

// One contract, run against every driver: what lib/practicals relies on from the photo store.
const ACCESS_KEY = 'BRINEWRIGHTTESTKEY01';
const SECRET = 'brinewright-test-secret-0123456789abcdef';
const BUCKET = 'brinewright-photos';

let fake: FakeS3;
let folder: string;
let s3Options: S3DriverOptions;

beforeAll(async () => {
  folder = fs.mkdtempSync(path.join(os.tmpdir(), 'brinewright-storage-'));
  fake = await startFakeS3({ root: path.join(folder, 's3'), accessKeyId: ACCESS_KEY, secretAccessKey: SECRET });
  s3Options = { bucket: BUCKET, region: 'us-east-1', accessKeyId: ACCESS_KEY, secretAccessKey: SECRET, endpoint: fake.url, forcePathStyle: true };
  // The bucket is made through the SDK, as an operator would with any S3 client.
  const client = new S3Client({
    region: 'us-east-1',
    endpoint: fake.url,
    forcePathStyle: true,
    credentials: { accessKeyId: ACCESS_KEY, secretAccessKey: SECRET },
  });
  await client.send(new CreateBucketCommand({ Bucket: BUCKET }));
  await client.send(new HeadBucketCommand({ Bucket: BUCKET }));
  client.destroy();
});
afterAll(async () => {
  await fake?.close();
  fs.rmSync(folder, { recursive: true, force: true });
});

// Bytes that are not text, so an encoding slip on the way would show.
const jpegLike = (seed: number, length = 70_000) => {
  const data = Buffer.alloc(length);
  for (let i = 0; i < length; i++) data[i] = (i * 31 + seed * 17) & 0xff;
  data[0] = 0xff;
  data[1] = 0xd8;
  return data;
};

const drivers: [string, () => StorageDriver][] = [
  ['disk', () => diskDriver(path.join(folder, 'disk'))],
  ['s3', () => s3Driver(s3Options)],
];

describe.each(drivers)('the %s driver', (name, make) => {
  it('names itself', () => {
    expect(make().name).toBe(name);
  });

  it('gives back the bytes and content type that were put', async () => {
    const storage = make();
    const data = jpegLike(1);
    await storage.put('photos/7/3f1c-a.jpg', data, 'image/jpeg');
    const stored = await storage.get('photos/7/3f1c-a.jpg');
    expect(stored).not.toBeNull();
    expect(stored!.contentType).toBe('image/jpeg');
    expect(stored!.data.equals(data)).toBe(true);
  });

  it('replaces an object put again under the same key', async () => {
    const storage = make();
    await storage.put('thumbs/7/replace-me.png', jpegLike(2, 100), 'image/png');
    await storage.put('thumbs/7/replace-me.png', jpegLike(3, 50), 'image/png');
    const stored = await storage.get('thumbs/7/replace-me.png');
    expect(stored!.data.equals(jpegLike(3, 50))).toBe(true);
    expect(stored!.contentType).toBe('image/png');
  });

  it('answers null for a key that was never stored', async () => {
    expect(await make().get('photos/7/never-stored.jpg')).toBeNull();
  });

  it('deletes an object, and deleting a missing key is not an error', async () => {
    const storage = make();
    await storage.put('photos/8/gone.webp', jpegLike(4, 10), 'image/webp');
    expect(await storage.get('photos/8/gone.webp')).not.toBeNull();
    await storage.delete('photos/8/gone.webp');
    expect(await storage.get('photos/8/gone.webp')).toBeNull();
    await expect(storage.delete('photos/8/gone.webp')).resolves.toBeUndefined();
  });

  it('refuses keys that could leave its folder or bucket prefix, before touching the store', async () => {
    const storage = make();
    const before = { ...fake.counts };
    for (const key of [
      '../escape.jpg',
      'photos/../../etc.jpg',
      '/absolute.jpg',
      'photos//double.jpg',
      'photos/no-extension',
      'photos/UPPER.jpg',
      'photos/x.exe',
    ]) {
      await expect(storage.put(key, jpegLike(5, 10), 'image/jpeg'), key).rejects.toThrow(/Invalid storage key/);
      await expect(storage.get(key), key).rejects.toThrow(/Invalid storage key/);
      await expect(storage.delete(key), key).rejects.toThrow(/Invalid storage key/);
    }
    expect(fake.counts).toEqual(before);
  });

  it('lets a second driver instance (another app server) read what the first stored', async () => {
    const first = make();
    const second = make();
    await first.put('photos/9/shared.jpg', jpegLike(6), 'image/jpeg');
    expect((await second.get('photos/9/shared.jpg'))!.data.equals(jpegLike(6))).toBe(true);
  });
});

describe('the S3 driver against the fake', () => {
  it('sends each operation as a signed path-style request the fake counts', async () => {
    const before = { ...fake.counts };
    const storage = s3Driver(s3Options);
    await storage.put('photos/10/counted.jpg', jpegLike(7, 20), 'image/jpeg');
    await storage.get('photos/10/counted.jpg');
    await storage.delete('photos/10/counted.jpg');
    expect(fake.counts.PutObject).toBe((before.PutObject ?? 0) + 1);
    expect(fake.counts.GetObject).toBe((before.GetObject ?? 0) + 1);
    expect(fake.counts.DeleteObject).toBe((before.DeleteObject ?? 0) + 1);
    // The fake keeps objects as files in its folder.
    await storage.put('photos/10/on-disk.jpg', jpegLike(8, 20), 'image/jpeg');
    expect(fs.readFileSync(path.join(folder, 's3', BUCKET, 'objects', 'photos', '10', 'on-disk.jpg')).equals(jpegLike(8, 20))).toBe(true);
  });

  it('fails with the service error when the secret is wrong, and stores nothing', async () => {
    const storage = s3Driver({ ...s3Options, secretAccessKey: 'not-the-secret-at-all-0000' });
    await expect(storage.put('photos/11/wrong-secret.jpg', jpegLike(9, 20), 'image/jpeg')).rejects.toMatchObject({ name: 'SignatureDoesNotMatch' });
    await expect(storage.get('photos/11/wrong-secret.jpg')).rejects.toMatchObject({ name: 'SignatureDoesNotMatch' });
    expect(await s3Driver(s3Options).get('photos/11/wrong-secret.jpg')).toBeNull();
  });

  it('fails when the access key is unknown, or the bucket does not exist', async () => {
    await expect(s3Driver({ ...s3Options, accessKeyId: 'SOMEONEELSESKEY00000' }).get('photos/11/a.jpg')).rejects.toMatchObject({ name: 'InvalidAccessKeyId' });
    await expect(s3Driver({ ...s3Options, bucket: 'no-such-bucket' }).put('photos/11/a.jpg', jpegLike(1, 5), 'image/jpeg')).rejects.toMatchObject({
      name: 'NoSuchBucket',
    });
  });

  it('answers 503 (AppError unavailable) when the store is not there, without hanging', async () => {
    const closed = http.createServer();
    await new Promise<void>((resolve) => closed.listen(0, '127.0.0.1', () => resolve()));
    const { port } = closed.address() as AddressInfo;
    await new Promise<void>((resolve) => closed.close(() => resolve()));
    const storage = s3Driver({ ...s3Options, endpoint: `http://127.0.0.1:${port}` });
    const started = Date.now();
    await expect(storage.put('photos/13/down.jpg', jpegLike(1, 5), 'image/jpeg')).rejects.toMatchObject({ name: 'AppError', status: 503 });
    await expect(storage.get('photos/13/down.jpg')).rejects.toMatchObject({
      name: 'AppError',
      status: 503,
      message: expect.stringMatching(/photo store cannot be reached/),
    });
    expect(Date.now() - started).toBeLessThan(10_000);
  });

  it('answers 503 when the store keeps answering 5xx, after the SDK has retried', async () => {
    let calls = 0;
    const failing = http.createServer((req, res) => {
      calls++;
      req.resume();
      res
        .writeHead(503, { 'content-type': 'application/xml' })
        .end('<?xml version="1.0" encoding="UTF-8"?><Error><Code>SlowDown</Code><Message>Please reduce your request rate.</Message></Error>');
    });
    await new Promise<void>((resolve) => failing.listen(0, '127.0.0.1', () => resolve()));
    try {
      const storage = s3Driver({ ...s3Options, endpoint: `http://127.0.0.1:${(failing.address() as AddressInfo).port}` });
      await expect(storage.get('photos/13/slow.jpg')).rejects.toMatchObject({ name: 'AppError', status: 503 });
      expect(calls).toBe(3); // maxAttempts
    } finally {
      await new Promise<void>((resolve) => failing.close(() => resolve()));
    }
  });

  it('refuses unsigned requests', async () => {
    const response = await fetch(`${fake.url}/${BUCKET}/photos/7/3f1c-a.jpg`);
    expect(response.status).toBe(403);
    expect(await response.text()).toContain('<Code>AccessDenied</Code>');
    const put = await fetch(`${fake.url}/${BUCKET}/photos/7/3f1c-a.jpg`, { method: 'PUT', body: 'overwritten' });
    expect(put.status).toBe(403);
    expect((await s3Driver(s3Options).get('photos/7/3f1c-a.jpg'))!.data.equals(jpegLike(1))).toBe(true);
  });
});

describe('choosing the driver from the configuration', () => {
  const base = { DATABASE_URL: 'mariadb://u:p@127.0.0.1:3307/brinewright', NEXTAUTH_SECRET: 'x'.repeat(32) };

  it('keeps the disk when nothing says otherwise', () => {
    const env = parseEnv(base);
    expect(env.STORAGE_DRIVER).toBe('disk');
    expect(storageFromEnv(env).name).toBe('disk');
  });

  it('uses the S3 bucket with STORAGE_DRIVER=s3, and that driver reaches the configured store', async () => {
    const env = parseEnv({
      ...base,
      STORAGE_DRIVER: 's3',
      S3_ENDPOINT: fake.url,
      S3_BUCKET: BUCKET,
      S3_ACCESS_KEY_ID: ACCESS_KEY,
      S3_SECRET_ACCESS_KEY: SECRET,
      S3_FORCE_PATH_STYLE: 'true',
    });
    expect(env).toMatchObject({ STORAGE_DRIVER: 's3', S3_REGION: 'us-east-1', S3_FORCE_PATH_STYLE: true });
    const storage = storageFromEnv(env);
    expect(storage.name).toBe('s3');
    await storage.put('photos/12/from-env.jpg', jpegLike(10, 30), 'image/jpeg');
    expect((await s3Driver(s3Options).get('photos/12/from-env.jpg'))!.data.equals(jpegLike(10, 30))).toBe(true);
  });

  it('names each S3 variable that STORAGE_DRIVER=s3 is missing, and malformed values', () => {
    expect(() => parseEnv({ ...base, STORAGE_DRIVER: 's3' })).toThrow(
      /S3_BUCKET is missing[\s\S]*S3_ACCESS_KEY_ID is missing[\s\S]*S3_SECRET_ACCESS_KEY is missing/,
    );
    expect(() => parseEnv({ ...base, STORAGE_DRIVER: 'ftp' })).toThrow(/STORAGE_DRIVER must be disk or s3/);
    expect(() => parseEnv({ ...base, S3_BUCKET: 'Not_A_Bucket' })).toThrow(/S3_BUCKET is malformed/);
    expect(() => parseEnv({ ...base, S3_ENDPOINT: 'not a url' })).toThrow(/S3_ENDPOINT is malformed/);
    expect(() => parseEnv({ ...base, S3_FORCE_PATH_STYLE: 'yes' })).toThrow(/S3_FORCE_PATH_STYLE must be true or false/);
  });
});

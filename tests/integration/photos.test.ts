import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { GET as getPhoto } from '@/app/api/photos/[id]/route';
import { POST as uploadPhoto } from '@/app/api/photos/route';
import { AppError } from '@/lib/errors';
import { getStorage, setStorage } from '@/lib/storage';
import { db } from '@/models';
import { createUser } from '../support/db';
import { params } from '../support/request';
import { actAs } from '../support/session';
import { LOOSE_PHOTO_DAYS, pruneLoosePhotos, submitPractical } from '@/lib/practicals/service';
import { enrolledLearner, GOOD_BATCH, makeJpeg, photoRequest, practicalSetting } from '../support/practical-fixtures';

const GPS_IFD_TAG = 0x8825; // TIFF/EXIF 2.3: the pointer to the GPS sub-IFD, written in IFD0

/** The tags of IFD0 in an EXIF block (TIFF header, either byte order). */
function ifd0Tags(exif: Buffer): number[] {
  const o = exif.subarray(0, 6).toString('latin1') === 'Exif\0\0' ? 6 : 0;
  const le = exif.subarray(o, o + 2).toString('latin1') === 'II';
  const u16 = (i: number) => (le ? exif.readUInt16LE(o + i) : exif.readUInt16BE(o + i));
  const u32 = (i: number) => (le ? exif.readUInt32LE(o + i) : exif.readUInt32BE(o + i));
  const ifd = u32(4);
  return Array.from({ length: u16(ifd) }, (_, i) => u16(ifd + 2 + 12 * i));
}

const fixture = practicalSetting();

async function storedImage(photoId: number, which: 'storageKey' | 'thumbnailKey' = 'storageKey') {
  const row = await db().PracticalPhoto.findByPk(photoId);
  const stored = await getStorage().get(row![which]);
  return { row: row!, data: stored!.data, meta: await sharp(stored!.data).metadata() };
}

describe('POST /api/photos', () => {
  it('re-encodes a JPEG with a location in its metadata: location and every tag gone, turned upright', async () => {
    const { learner } = await enrolledLearner(fixture.current.flagship.id);
    actAs(learner);
    // 400 × 300 stored sideways with orientation 6 (rotate 90° clockwise to view), a camera make and a GPS position.
    const input = await makeJpeg(400, 300, (s) =>
      s
        .withExif({
          IFD0: { Make: 'BrineTestCam', Model: 'Jar-1' },
          IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '40/1 26/1 4636/100', GPSLongitudeRef: 'W', GPSLongitude: '105/1 3/1 0/1' },
        })
        .withMetadata({ orientation: 6 }),
    );
    const before = await sharp(input).metadata();
    expect(before.orientation).toBe(6);
    expect(ifd0Tags(before.exif!)).toContain(GPS_IFD_TAG);
    expect(before.exif!.toString('latin1')).toContain('BrineTestCam');

    const response = await uploadPhoto(photoRequest(input, 'IMG_0001.jpg', 'image/jpeg'), {});
    expect(response.status).toBe(201);
    const { photo } = await response.json();
    expect(photo).toMatchObject({ receivedAs: 'jpeg', width: 300, height: 400, url: `/api/photos/${photo.id}` });

    const { row, data, meta } = await storedImage(photo.id);
    expect(row.userId).toBe(learner.id);
    expect(row.practicalId).toBeNull();
    expect(meta.format).toBe('jpeg');
    expect([meta.width, meta.height]).toEqual([300, 400]);
    expect(meta.exif).toBeUndefined();
    expect(meta.orientation).toBeUndefined();
    expect(meta.icc).toBeUndefined();
    expect(data.toString('latin1')).not.toContain('BrineTestCam');
    expect(data.includes(Buffer.from('Exif\0\0', 'latin1'))).toBe(false);
  });

  it('decides the type from the content: a PNG named .jpg and sent as image/jpeg is accepted as a PNG', async () => {
    const { learner } = await enrolledLearner(fixture.current.flagship.id);
    actAs(learner);
    const png = await sharp({ create: { width: 120, height: 80, channels: 4, background: { r: 20, g: 120, b: 90, alpha: 0.5 } } })
      .png()
      .toBuffer();
    const response = await uploadPhoto(photoRequest(png, 'lids.jpg', 'image/jpeg'), {});
    expect(response.status).toBe(201);
    const { photo } = await response.json();
    expect(photo.receivedAs).toBe('png');
    const { meta } = await storedImage(photo.id);
    expect(meta).toMatchObject({ format: 'jpeg', width: 120, height: 80 });
  });

  it('accepts WebP and scales a large photo to 2000 px on the long side with a 320 px thumbnail', async () => {
    const { learner } = await enrolledLearner(fixture.current.flagship.id);
    actAs(learner);
    const webp = await sharp(await makeJpeg(3000, 1200))
      .webp()
      .toBuffer();
    const response = await uploadPhoto(photoRequest(webp, 'shelf.webp', 'image/webp'), {});
    expect(response.status).toBe(201);
    const { photo } = await response.json();
    expect(photo).toMatchObject({ receivedAs: 'webp', width: 2000, height: 800 });
    expect((await storedImage(photo.id)).meta).toMatchObject({ width: 2000, height: 800 });
    expect((await storedImage(photo.id, 'thumbnailKey')).meta).toMatchObject({ width: 320, height: 128 });
  });

  it('answers a text file named .jpg with 415 and a clear message, and stores nothing', async () => {
    const { learner } = await enrolledLearner(fixture.current.flagship.id);
    actAs(learner);
    const filesBefore = fixture.storage.files();
    const response = await uploadPhoto(photoRequest(Buffer.from('These are my pickles, honestly.\n'.repeat(50)), 'pickles.jpg', 'image/jpeg'), {});
    expect(response.status).toBe(415);
    expect((await response.json()).message).toMatch(/not a JPEG, PNG or WebP photo/);
    expect(await db().PracticalPhoto.count()).toBe(0);
    expect(fixture.storage.files()).toEqual(filesBefore);
  });

  it('answers 415 for a file that only starts like a JPEG but is not one', async () => {
    const { learner } = await enrolledLearner(fixture.current.flagship.id);
    actAs(learner);
    const fake = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.from('not really a picture'.repeat(20))]);
    const response = await uploadPhoto(photoRequest(fake, 'x.jpg', 'image/jpeg'), {});
    expect(response.status).toBe(415);
    expect(await db().PracticalPhoto.count()).toBe(0);
  });

  it('leaves nothing behind when the store fails between the photo and its thumbnail', async () => {
    const { learner } = await enrolledLearner(fixture.current.flagship.id);
    actAs(learner);
    const real = getStorage();
    // The photo is stored, then the store stops answering before the thumbnail is written.
    setStorage({
      name: 'fails-on-thumbnails',
      put: (key, data, type) =>
        key.startsWith('thumbs/') ? Promise.reject(new AppError('unavailable', 'The photo store is not answering.')) : real.put(key, data, type),
      get: (key) => real.get(key),
      delete: (key) => real.delete(key),
    });
    const filesBefore = fixture.storage.files();
    try {
      const response = await uploadPhoto(photoRequest(await makeJpeg(400, 300), 'jars.jpg', 'image/jpeg'), {});
      expect(response.status).toBe(503);
      expect((await response.json()).message).toMatch(/photo store/);
    } finally {
      setStorage(real);
    }
    expect(await db().PracticalPhoto.count()).toBe(0);
    expect(fixture.storage.files()).toEqual(filesBefore);
  });

  it('answers an 11 MB file with 413 and stores nothing', async () => {
    const { learner } = await enrolledLearner(fixture.current.flagship.id);
    actAs(learner);
    const big = Buffer.alloc(11 * 1024 * 1024, 7);
    big.set([0xff, 0xd8, 0xff, 0xe0]);
    const filesBefore = fixture.storage.files();
    const response = await uploadPhoto(photoRequest(big, 'huge.jpg', 'image/jpeg'), {});
    expect(response.status).toBe(413);
    expect((await response.json()).message).toMatch(/larger than 10 MB/);
    expect(await db().PracticalPhoto.count()).toBe(0);
    expect(fixture.storage.files()).toEqual(filesBefore);
  });

  it('answers 413 from the declared length alone, before reading the body', async () => {
    const { learner } = await enrolledLearner(fixture.current.flagship.id);
    actAs(learner);
    const request = new Request('http://localhost:3000/api/photos', {
      method: 'POST',
      headers: { 'content-type': 'multipart/form-data; boundary=x', 'content-length': String(50 * 1024 * 1024) },
      body: '--x--',
    });
    expect((await uploadPhoto(request, {})).status).toBe(413);
  });

  it('takes photos only from a signed-in learner with an active enrollment in the course', async () => {
    const jpeg = await makeJpeg(64, 64);
    expect((await uploadPhoto(photoRequest(jpeg, 'a.jpg', 'image/jpeg'), {})).status).toBe(401);
    actAs(fixture.current.instructor);
    expect((await uploadPhoto(photoRequest(jpeg, 'a.jpg', 'image/jpeg'), {})).status).toBe(403);
    const { learner: unpaid } = await enrolledLearner(fixture.current.flagship.id, 'awaiting_payment');
    actAs(unpaid);
    expect((await uploadPhoto(photoRequest(jpeg, 'a.jpg', 'image/jpeg'), {})).status).toBe(403);
    const { learner: other } = await enrolledLearner(fixture.current.refresher.id);
    actAs(other);
    expect((await uploadPhoto(photoRequest(jpeg, 'a.jpg', 'image/jpeg'), {})).status).toBe(403);
    expect((await uploadPhoto(photoRequest(jpeg, 'a.jpg', 'image/jpeg', 'volunteer-refresher'), {})).status).toBe(201);
    expect(await db().PracticalPhoto.count()).toBe(1);
  });
});

describe('GET /api/photos/[id]', () => {
  it('serves a photo to its owner, to staff once it is part of a submission, and 403 to another learner', async () => {
    const { learner } = await enrolledLearner(fixture.current.flagship.id);
    const { learner: other } = await enrolledLearner(fixture.current.flagship.id);
    actAs(learner);
    const uploaded = await (await uploadPhoto(photoRequest(await makeJpeg(300, 200), 'jars.jpg', 'image/jpeg'), {})).json();
    const id = String(uploaded.photo.id);
    const get = (size?: string) => getPhoto(new Request(`http://localhost:3000/api/photos/${id}${size ? `?size=${size}` : ''}`), params({ id }));

    const own = await get();
    expect(own.status).toBe(200);
    expect(own.headers.get('content-type')).toBe('image/jpeg');
    expect(own.headers.get('cache-control')).toMatch(/^private/);
    const bytes = Buffer.from(await own.arrayBuffer());
    expect(await sharp(bytes).metadata()).toMatchObject({ width: 300, height: 200 });
    const thumb = Buffer.from(await (await get('thumb')).arrayBuffer());
    // Never enlarged: a 300 px photo keeps a 300 px thumbnail.
    expect(await sharp(thumb).metadata()).toMatchObject({ width: 300, height: 200 });

    // A loose upload (not yet in a submission) is the learner's own draft: staff are refused.
    const staff = [fixture.current.instructor, await createUser('coordinator'), await createUser('admin')];
    for (const person of staff) {
      actAs(person);
      const loose = await get();
      expect(loose.status, person.roles.join('+')).toBe(403);
      expect((await loose.json()).message).toMatch(/not part of a submission/);
    }
    // Once it belongs to a submission, every instructor and coordinator may see it.
    await submitPractical(learner, 'pickling-and-canning', GOOD_BATCH([Number(id)]));
    for (const person of staff) {
      actAs(person);
      expect((await get()).status, person.roles.join('+')).toBe(200);
    }

    actAs(other);
    const refused = await get();
    expect(refused.status).toBe(403);
    expect(refused.headers.get('content-type')).toMatch(/json/);
    actAs(null);
    expect((await get()).status).toBe(401);

    actAs(learner);
    const missing = String(uploaded.photo.id + 1000);
    expect((await getPhoto(new Request(`http://localhost:3000/api/photos/${missing}`), params({ id: missing }))).status).toBe(404);
    expect((await getPhoto(new Request('http://localhost:3000/api/photos/../x'), params({ id: '../x' }))).status).toBe(404);
  });
});

describe('photos never submitted (the worker’s pruneLoosePhotos)', () => {
  it('removes rows and objects of photos loose for more than LOOSE_PHOTO_DAYS; submitted and recent ones stay', async () => {
    const { learner } = await enrolledLearner(fixture.current.flagship.id);
    actAs(learner);
    const ids: number[] = [];
    for (let i = 0; i < 5; i++) {
      const uploaded = await (await uploadPhoto(photoRequest(await makeJpeg(320, 240), `jar-${i}.jpg`, 'image/jpeg'), {})).json();
      ids.push(uploaded.photo.id);
    }
    const [oldA, oldB, submittedA, submittedB, recent] = ids;
    await submitPractical(learner, 'pickling-and-canning', GOOD_BATCH([submittedA, submittedB]));
    const now = new Date();
    const daysAgo = (d: number) => new Date(now.getTime() - d * 86_400_000);
    const { PracticalPhoto } = db();
    await PracticalPhoto.update({ createdAt: daysAgo(LOOSE_PHOTO_DAYS + 1) }, { where: { id: [oldA, oldB, submittedA, submittedB] }, silent: true });
    await PracticalPhoto.update({ createdAt: daysAgo(LOOSE_PHOTO_DAYS - 1) }, { where: { id: recent }, silent: true });
    const keysOf = async (id: number) => {
      const row = await PracticalPhoto.findByPk(id);
      return [row!.storageKey, row!.thumbnailKey];
    };
    const goneKeys = [...(await keysOf(oldA)), ...(await keysOf(oldB))];
    const keptKeys = [...(await keysOf(submittedA)), ...(await keysOf(submittedB)), ...(await keysOf(recent))];
    // The folder is shared with the other tests of this file: count what this one changes.
    const filesBefore = fixture.storage.files().length;

    expect(await pruneLoosePhotos({ now })).toBe(2);
    const left = (await PracticalPhoto.findAll({ where: { id: ids } })).map((p) => p.id).sort((a, b) => a - b);
    expect(left).toEqual([submittedA, submittedB, recent].sort((a, b) => a - b));
    for (const key of goneKeys) expect(await getStorage().get(key), key).toBeNull();
    for (const key of keptKeys) expect(await getStorage().get(key), key).not.toBeNull();
    expect(fixture.storage.files()).toHaveLength(filesBefore - 4);
    // Nothing is left to remove; a day later the recent one is still inside its week.
    expect(await pruneLoosePhotos({ now })).toBe(0);
    expect(await pruneLoosePhotos({ now: new Date(now.getTime() + 0.5 * 86_400_000) })).toBe(0);
    expect(await pruneLoosePhotos({ now: new Date(now.getTime() + 1.5 * 86_400_000) })).toBe(1);
  });
});

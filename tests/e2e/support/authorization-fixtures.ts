// The records the authorization walk needs, made in the browser-test database beside the demo seed:
// two learners of their own (A and B), an instructor who is nothing else (Ingrid: the demo instructor
// is also a learner, the matrix's volunteer column), a past workshop of Ingrid's they are both in,
// their enrollments and certificates (SQL), their quiz attempts and photos (through the app's own
// routes, signed in as each). Nothing here touches the demo people the other browser tests use.
import bcrypt from 'bcryptjs';
import mariadb from 'mariadb';
import sharp from 'sharp';
import { generateSerial } from '../../../lib/certificates/serial';
import { mariadbOptions } from '../../support/mariadb-options';
import type { Fixtures } from './authorization-matrix';
import { send, signInHttp, type Jar } from './http';

export const FIXTURE_PASSWORD = 'authz-matrix-pass-123';

type Conn = mariadb.Connection;

export async function connect(): Promise<Conn> {
  const raw = process.env.E2E_DATABASE_URL;
  if (!raw) throw new Error('E2E_DATABASE_URL is not set');
  return mariadb.createConnection({
    ...mariadbOptions(raw),
    bigIntAsNumber: true,
    insertIdAsNumber: true,
  });
}

const one = async <T>(conn: Conn, sql: string, values: unknown[]): Promise<T> => {
  const rows = (await conn.query(sql, values)) as T[];
  if (!rows[0]) throw new Error(`no row for ${sql} ${JSON.stringify(values)}`);
  return rows[0];
};
const insert = async (conn: Conn, sql: string, values: unknown[]): Promise<number> =>
  Number(((await conn.query(sql, values)) as { insertId: number }).insertId);

async function startAttempt(jar: Jar, quiz: string): Promise<number> {
  const response = await send(`/api/quizzes/${quiz}/attempts`, { method: 'POST', jar, body: {} });
  if (response.status !== 201) throw new Error(`starting ${quiz}: ${response.status} ${await response.text()}`);
  return ((await response.json()) as { attempt: { id: number } }).attempt.id;
}

async function uploadPhoto(jar: Jar, jpeg: Uint8Array): Promise<number> {
  const form = new FormData();
  form.set('course', 'pickling-and-canning');
  form.set('photo', new Blob([jpeg as BlobPart], { type: 'image/jpeg' }), 'jars.jpg');
  const response = await send('/api/photos', { method: 'POST', jar, body: form });
  if (response.status !== 201) throw new Error(`uploading a photo: ${response.status} ${await response.text()}`);
  return ((await response.json()) as { photo: { id: number } }).photo.id;
}

export type MatrixPeople = { fixtures: Fixtures; emails: { a: string; b: string; instructor: string } };

export async function createAuthorizationFixtures(): Promise<MatrixPeople> {
  const conn = await connect();
  try {
    const now = new Date();
    const stamp = `${Date.now()}`;
    const ids = async (email: string) => (await one<{ id: number }>(conn, 'SELECT id FROM users WHERE email = ?', [email])).id;
    const coordinatorId = await ids('coordinator@cedarhollow.example');
    const course = async (slug: string) =>
      one<{ id: number; title: string; validityMonths: number }>(conn, 'SELECT id, title, validityMonths FROM courses WHERE slug = ?', [slug]);
    const flagship = await course('pickling-and-canning');
    const refresher = await course('volunteer-refresher');
    const hash = bcrypt.hashSync(FIXTURE_PASSWORD, 10);
    const emails = { a: `authz-a-${stamp}@test.example`, b: `authz-b-${stamp}@test.example`, instructor: `authz-i-${stamp}@test.example` };
    const instructorId = await insert(
      conn,
      "INSERT INTO users (email, name, passwordHash, roles, emailVerifiedAt, createdAt, updatedAt) VALUES (?, ?, ?, 'instructor', ?, ?, ?)",
      [emails.instructor, 'Ingrid Matrix', hash, now, now, now],
    );
    const startsAt = new Date(now.getTime() - 40 * 86_400_000);
    const workshopId = await insert(
      conn,
      'INSERT INTO workshops (courseId, instructorId, startsAt, endsAt, timeZone, place, seats, attendanceRequired, createdAt, updatedAt) VALUES (?, ?, ?, ?, ?, ?, ?, 1, ?, ?)',
      [
        flagship.id,
        instructorId,
        startsAt,
        new Date(startsAt.getTime() + 4 * 3_600_000),
        'America/Denver',
        'Cedar Hollow Grange hall, back kitchen',
        8,
        now,
        now,
      ],
    );
    const person = async (email: string, name: string, refresherStatus: 'withdrawn' | 'active') => {
      const userId = await insert(
        conn,
        "INSERT INTO users (email, name, passwordHash, roles, emailVerifiedAt, createdAt, updatedAt) VALUES (?, ?, ?, 'learner', ?, ?, ?)",
        [email, name, hash, now, now, now],
      );
      const enrollmentId = await insert(
        conn,
        "INSERT INTO enrollments (userId, courseId, workshopId, runKey, status, feeCents, createdAt, updatedAt) VALUES (?, ?, ?, ?, 'active', 4500, ?, ?)",
        [userId, flagship.id, workshopId, String(workshopId), now, now],
      );
      const refresherEnrollmentId = await insert(
        conn,
        'INSERT INTO enrollments (userId, courseId, workshopId, runKey, status, feeCents, createdAt, updatedAt) VALUES (?, ?, NULL, ?, ?, 1500, ?, ?)',
        [userId, refresher.id, 'self-paced', refresherStatus, now, now],
      );
      const serial = generateSerial();
      const validUntil = new Date(now);
      validUntil.setUTCMonth(validUntil.getUTCMonth() + flagship.validityMonths);
      const certificateId = await insert(
        conn,
        'INSERT INTO certificates (enrollmentId, userId, issuedById, serial, holderName, courseTitle, programName, issuedAt, validUntil, createdAt, updatedAt) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)',
        [enrollmentId, userId, coordinatorId, serial, name, flagship.title, 'Authorization matrix program', now, validUntil, now, now],
      );
      return { enrollmentId, refresherEnrollmentId, serial, certificateId };
    };
    const a = await person(emails.a, 'Avery Matrix', 'withdrawn');
    const b = await person(emails.b, 'Bellamy Matrix', 'active');
    // A practical batch of a demo learner, waiting at the Tasting table (read, never reviewed here).
    const practical = await one<{ id: number }>(
      conn,
      "SELECT p.id FROM practicals p JOIN users u ON u.id = p.userId WHERE u.email = 'idris.fairweather@cedarhollow.example'",
      [],
    );

    const jpeg = new Uint8Array(
      await sharp({ create: { width: 640, height: 480, channels: 3, background: '#7a9e7e' } })
        .jpeg({ quality: 80 })
        .toBuffer(),
    );
    const signedA = await signInHttp(emails.a, FIXTURE_PASSWORD);
    const signedB = await signInHttp(emails.b, FIXTURE_PASSWORD);
    const fixtures: Fixtures = {
      a: { ...a, attemptId: await startAttempt(signedA.jar, 'pickling-and-canning--processing'), photoId: await uploadPhoto(signedA.jar, jpeg) },
      b: { ...b, attemptId: await startAttempt(signedB.jar, 'pickling-and-canning--processing'), photoId: await uploadPhoto(signedB.jar, jpeg) },
      workshopId,
      practicalId: practical.id,
      jpeg,
    };
    return { fixtures, emails };
  } finally {
    await conn.end();
  }
}

import { beforeEach, describe, expect, it } from 'vitest';
import { GET as verifyRoute } from '@/app/api/certificates/[serial]/route';
import { issueCertificate } from '@/lib/certificates/issue';
import { generateSerial } from '@/lib/certificates/serial';
import { getEnv } from '@/lib/env';
import { db } from '@/models';
import { createCourses, resetDatabase } from '../support/db';
import { params } from '../support/request';
import { eligibleEnrollment } from '../support/certificate-fixtures';

const check = (serial: string, address = '203.0.113.7') =>
  verifyRoute(new Request(`http://localhost/api/certificates/${encodeURIComponent(serial)}`, { headers: { 'x-forwarded-for': address } }), params({ serial }));

beforeEach(async () => {
  await resetDatabase();
});

describe('GET /api/certificates/:serial', () => {
  it('shows a valid certificate with the name, course and dates and nothing more', async () => {
    const courses = await createCourses();
    const { enrollmentId } = await eligibleEnrollment(courses.flagship, { name: 'Søren Åkesson', email: 'soren@test.example' });
    const issued = (await issueCertificate(enrollmentId, null, { now: new Date() })) as { serial: string };
    const response = await check(issued.serial.toLowerCase().replace(/-/g, ' '));
    expect(response.status).toBe(200);
    const body = await response.json();
    expect(Object.keys(body).sort()).toEqual([
      'courseTitle',
      'found',
      'issuedAt',
      'learnerName',
      'programName',
      'replaced',
      'revokedAt',
      'serial',
      'state',
      'validUntil',
    ]);
    expect(body).toMatchObject({
      serial: issued.serial,
      state: 'valid',
      learnerName: 'Søren Åkesson',
      courseTitle: 'Safe Pickling and Water-Bath Canning',
      revokedAt: null,
      replaced: null,
    });
    expect(JSON.stringify(body)).not.toContain('soren@test.example');
  });

  it('says expired and revoked, without the revocation reason', async () => {
    const courses = await createCourses();
    const a = await eligibleEnrollment(courses.flagship);
    const b = await eligibleEnrollment(courses.flagship);
    const old = (await issueCertificate(a.enrollmentId, null, { now: new Date('2020-01-01T00:00:00Z') })) as { serial: string };
    const revoked = (await issueCertificate(b.enrollmentId, null)) as { serial: string; certificateId: number };
    await db().Certificate.update({ revokedAt: new Date(), revokeReason: 'private reason text' }, { where: { id: revoked.certificateId } });
    expect(await (await check(old.serial)).json()).toMatchObject({ state: 'expired', validUntil: '2023-01-01T00:00:00.000Z' });
    const body = await (await check(revoked.serial)).json();
    expect(body.state).toBe('revoked');
    expect(JSON.stringify(body)).not.toContain('private reason');
  });

  it('answers 404 for an unknown serial and 400 for a mistyped one', async () => {
    const unknown = generateSerial();
    const response = await check(unknown);
    expect(response.status).toBe(404);
    expect((await response.json()).message).toMatch(/No certificate/);
    const typo = unknown.slice(0, -1) + (unknown.endsWith('2') ? '3' : '2');
    expect((await check(typo)).status).toBe(400);
  });

  it('throttles per address, counted in MariaDB, with Retry-After', async () => {
    const max = getEnv().VERIFY_MAX_PER_ADDRESS;
    const serial = generateSerial();
    for (let i = 0; i < max; i++) expect((await check(serial, '198.51.100.1')).status).toBe(404);
    const over = await check(serial, '198.51.100.1');
    expect(over.status).toBe(429);
    expect(Number(over.headers.get('retry-after'))).toBeGreaterThan(0);
    // Another address still gets an answer.
    expect((await check(serial, '198.51.100.2')).status).toBe(404);
    const [row] = (await db().sequelize.query("SELECT hits FROM rate_limits WHERE bucket = 'verify:198.51.100.1'")) as [{ hits: number }[], unknown];
    expect(Number(row[0].hits)).toBe(max + 1);
  });
});

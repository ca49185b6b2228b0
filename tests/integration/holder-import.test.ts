// Bringing a program's existing certificate holders in from a CSV file, against the real MariaDB.
import bcrypt from 'bcryptjs';
import { beforeEach, describe, expect, it } from 'vitest';
import { loadStandings } from '@/lib/certificates/facts';
import { verifySerial } from '@/lib/certificates/lookup';
import { AppError } from '@/lib/errors';
import { importHolders, previewHolderImport } from '@/lib/import/holders';
import { POST as importRoute } from '@/app/api/desk/import/route';
import { POST as previewRoute } from '@/app/api/desk/import/preview/route';
import { db } from '@/models';
import { createCourses, createUser, resetDatabase } from '../support/db';
import { jsonRequest } from '../support/request';
import { actAs } from '../support/session';
import { eligibleEnrollment } from '../support/certificate-fixtures';
import { issueCertificate } from '@/lib/certificates/issue';

const HEADER = 'name,email,course,certificate_date,end_date,old_serial';
const GOOD = [
  HEADER,
  'Rosa Ilunga,rosa@county.example,pickling-and-canning,2024-05-18,2027-05-18,CH-2024-0117',
  '"Okafor, Bea",bea@county.example,pickling-and-canning,2025-03-02,2028-03-02,',
  'Rosa Ilunga,rosa@county.example,volunteer-refresher,2025-06-01,2028-06-01,CH-R-0009',
].join('\n');

let courses: Awaited<ReturnType<typeof createCourses>>;
beforeEach(async () => {
  await resetDatabase();
  courses = await createCourses();
});

async function refusal(call: Promise<unknown>): Promise<AppError> {
  const error = await call.then(
    () => null,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(AppError);
  return error as AppError;
}

describe('importing certificate holders', () => {
  it('previews a good file without writing, then imports it in one go: accounts without a password, certificates verifiable by both serials, audited', async () => {
    const coordinator = await createUser('coordinator');
    const preview = await previewHolderImport(GOOD);
    expect(preview.counts).toEqual({ create: 3, skip: 0, refuse: 0 });
    expect(preview.lines.map((l) => [l.line, l.outcome, l.name, l.newAccount])).toEqual([
      [2, 'create', 'Rosa Ilunga', true],
      [3, 'create', 'Okafor, Bea', true],
      [4, 'create', 'Rosa Ilunga', false],
    ]);
    expect(await db().Certificate.count()).toBe(0);

    const done = await importHolders(GOOD, coordinator.id);
    expect(done.counts).toEqual({ create: 3, skip: 0, refuse: 0 });
    const rosa = (await db().User.findOne({ where: { email: 'rosa@county.example' } }))!;
    expect(rosa.emailVerifiedAt).toBeNull();
    // No password works: the hash is of a secret nobody kept.
    expect(await bcrypt.compare('', rosa.passwordHash)).toBe(false);
    const certs = await db().Certificate.findAll({ where: { userId: rosa.id }, order: [['issuedAt', 'ASC']] });
    expect(certs.map((c) => [c.legacySerial, c.issuedAt.toISOString().slice(0, 10), c.validUntil.toISOString().slice(0, 10), c.holderName])).toEqual([
      ['CH-2024-0117', '2024-05-18', '2027-05-18', 'Rosa Ilunga'],
      ['CH-R-0009', '2025-06-01', '2028-06-01', 'Rosa Ilunga'],
    ]);
    const byOld = await verifySerial('CH-2024-0117', new Date('2026-12-04T00:00:00Z'));
    const byNew = await verifySerial(certs[0].serial, new Date('2026-12-04T00:00:00Z'));
    expect(byOld).toMatchObject({ found: true, state: 'valid', learnerName: 'Rosa Ilunga', courseTitle: 'Safe Pickling and Water-Bath Canning' });
    expect(byNew).toMatchObject({ found: true, state: 'valid', learnerName: 'Rosa Ilunga' });
    const audits = await db().AuditLog.findAll({ where: { action: 'certificate.imported' } });
    expect(audits).toHaveLength(3);
    expect(audits.every((a) => a.actorId === coordinator.id)).toBe(true);
  });

  it('counts an imported certificate as the earlier certificate a refresher renews', async () => {
    await importHolders(GOOD.split('\n').slice(0, 3).join('\n'), (await createUser('coordinator')).id);
    const bea = (await db().User.findOne({ where: { email: 'bea@county.example' } }))!;
    const { enrollmentId } = await eligibleEnrollment(courses.refresher, { userId: bea.id });
    const standing = (await loadStandings([enrollmentId])).get(enrollmentId)!;
    expect(standing.prior).toHaveLength(1);
    // An imported holder's address is unconfirmed until they confirm it (a password reset link does).
    expect(standing.eligibility.missing).toEqual(['email']);
    await bea.update({ emailVerifiedAt: new Date() });
    expect((await loadStandings([enrollmentId])).get(enrollmentId)!.eligibility.eligible).toBe(true);
  });

  it('re-importing the same file skips every line as already imported and writes nothing', async () => {
    const coordinator = await createUser('coordinator');
    await importHolders(GOOD, coordinator.id);
    const again = await importHolders(GOOD, coordinator.id);
    expect(again.counts).toEqual({ create: 0, skip: 3, refuse: 0 });
    expect(again.lines.every((l) => l.reason?.startsWith('already imported'))).toBe(true);
    expect(await db().Certificate.count()).toBe(3);
    expect(await db().User.count({ where: { email: ['rosa@county.example', 'bea@county.example'] } })).toBe(2);
  });

  it('reports every kind of bad line by its line number and imports nothing while any is refused', async () => {
    const coordinator = await createUser('coordinator');
    const holder = await createUser('learner', { email: 'held@county.example' });
    const { enrollmentId } = await eligibleEnrollment(courses.flagship, { userId: holder.id });
    await issueCertificate(enrollmentId, coordinator.id);
    const file = [
      HEADER,
      'Good Line,good@county.example,pickling-and-canning,2024-01-10,2027-01-10,OLD-1',
      'No Course,nc@county.example,fermenting-101,2024-01-10,2027-01-10,',
      'Backwards,bw@county.example,pickling-and-canning,2027-01-10,2024-01-10,',
      'Bad Date,bd@county.example,pickling-and-canning,2024-02-30,2027-02-28,',
      'Bad Mail,not-an-address,pickling-and-canning,2024-01-10,2027-01-10,',
      'Held Already,held@county.example,pickling-and-canning,2024-01-10,2027-01-10,',
      'Same Old Serial,other@county.example,pickling-and-canning,2024-01-10,2027-01-10,OLD-1',
      'Good Line,good@county.example,pickling-and-canning,2024-01-10,2027-01-10,OLD-1',
    ].join('\n');
    const preview = await previewHolderImport(file);
    expect(preview.lines.map((l) => [l.line, l.outcome])).toEqual([
      [2, 'create'],
      [3, 'refuse'],
      [4, 'refuse'],
      [5, 'refuse'],
      [6, 'refuse'],
      [7, 'refuse'],
      [8, 'refuse'],
      [9, 'skip'],
    ]);
    const reasons = Object.fromEntries(preview.lines.map((l) => [l.line, l.reason]));
    expect(reasons[3]).toMatch(/^course: no course "fermenting-101"/);
    expect(reasons[4]).toBe('end_date: must be after certificate_date');
    expect(reasons[5]).toBe('certificate_date: not a calendar date');
    expect(reasons[6]).toMatch(/^email: Enter a valid e-mail address/);
    expect(reasons[7]).toMatch(/^held@county\.example already holds a certificate for pickling-and-canning/);
    expect(reasons[8]).toBe('old_serial OLD-1 is also on line 2');
    expect(reasons[9]).toBe('duplicate of line 2 (same e-mail and course)');

    const error = await refusal(importHolders(file, coordinator.id));
    expect(error.status).toBe(422);
    expect(await db().User.count({ where: { email: 'good@county.example' } })).toBe(0);
    expect(await db().Certificate.count()).toBe(1);
  });

  it('refuses a file that is not CSV, or lacks a column, as a whole', async () => {
    expect((await refusal(previewHolderImport('name,email\n"unclosed,quote@x.example'))).message).toMatch(/could not be read as CSV/);
    expect((await refusal(previewHolderImport('\u0000\u0001PNG binary'))).message).toMatch(/not a CSV text file/);
    expect((await refusal(previewHolderImport('name,email,course,certificate_date\nA,a@x.example,pickling-and-canning,2024-01-01'))).message).toMatch(
      /^missing column\(s\): end_date/,
    );
    expect((await refusal(previewHolderImport(`${HEADER},notes\nA,a@x.example,pickling-and-canning,2024-01-01,2027-01-01,,hi`))).message).toMatch(
      /unknown column\(s\): notes/,
    );
  });

  it('answers the page through its two routes: the preview, a refusal with the new preview (422), then the import (201)', async () => {
    actAs(await createUser('coordinator'));
    const preview = await previewRoute(jsonRequest('/api/desk/import/preview', { text: GOOD }), {} as never);
    expect(preview.status).toBe(200);
    expect(((await preview.json()) as { preview: { counts: unknown } }).preview.counts).toEqual({ create: 3, skip: 0, refuse: 0 });
    const refused = await importRoute(
      jsonRequest('/api/desk/import', {
        text: `${GOOD}
No Course,nc@county.example,fermenting-101,2024-01-10,2027-01-10,`,
      }),
      {} as never,
    );
    const body = (await refused.json()) as { error: string; preview: { counts: unknown } };
    expect([refused.status, body.error, body.preview.counts]).toEqual([422, 'unprocessable', { create: 3, skip: 0, refuse: 1 }]);
    expect(await db().Certificate.count()).toBe(0);
    const done = await importRoute(jsonRequest('/api/desk/import', { text: GOOD }), {} as never);
    expect(done.status).toBe(201);
    expect(await db().Certificate.count()).toBe(3);
  });
});

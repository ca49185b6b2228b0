import { beforeEach, describe, expect, it } from 'vitest';
import { PDFParse } from 'pdf-parse';
import { POST as issueRoute } from '@/app/api/desk/certificates/route';
import { POST as revokeRoute } from '@/app/api/desk/certificates/[id]/revoke/route';
import { GET as pdfRoute } from '@/app/api/certificates/[serial]/pdf/route';
import { GET as deskRoute } from '@/app/api/desk/enrollments/route';
import { POST as claimRoute } from '@/app/api/certificates/refresher/route';
import { claimableRefreshers, issueCertificate, issueCertificates } from '@/lib/certificates/issue';
import { loadStandings } from '@/lib/certificates/facts';
import { normalizeSerial } from '@/lib/certificates/serial';
import { fetchLearnerCertificates, verifySerial } from '@/lib/certificates/lookup';
import { db } from '@/models';
import { getBank } from '@/lib/quiz/bank';
import { requirementsForCourse } from '@/lib/certificates/requirements';
import { createCourses, createUser, resetDatabase } from '../support/db';
import { jsonRequest, params } from '../support/request';
import { actAs } from '../support/session';
import { certificateCount, eligibleEnrollment } from '../support/certificate-fixtures';

let courses: Awaited<ReturnType<typeof createCourses>>;

beforeEach(async () => {
  await resetDatabase();
  actAs(null);
  courses = await createCourses();
});

describe('eligibility loader', () => {
  it('gathers the facts for many enrollments and names what each one misses', async () => {
    const done = await eligibleEnrollment(courses.flagship);
    const unpaid = await eligibleEnrollment(courses.flagship, { skip: { paid: true } });
    const waived = await eligibleEnrollment(courses.flagship, { skip: { paid: true }, waiver: true });
    const noPractical = await eligibleEnrollment(courses.flagship, { skip: { practical: true, attended: true } });
    const noExam = await eligibleEnrollment(courses.flagship, { skip: { finalExam: true, lessons: true } });
    const map = await loadStandings([done, unpaid, waived, noPractical, noExam].map((e) => e.enrollmentId));
    expect(map.get(done.enrollmentId)!.eligibility.eligible).toBe(true);
    expect(map.get(unpaid.enrollmentId)!.eligibility.missing).toEqual(['fee']);
    expect(map.get(waived.enrollmentId)!.eligibility.eligible).toBe(true);
    expect(map.get(noPractical.enrollmentId)!.eligibility.missing).toEqual(['practical', 'workshop']);
    expect(map.get(noExam.enrollmentId)!.eligibility.missing).toEqual(['lessons', 'final-exam']);
  });
});

describe('issuing', () => {
  it('issues one certificate with a valid serial, the validity from the course, an audit entry and an e-mail with the PDF', async () => {
    const coordinator = await createUser('coordinator');
    const { enrollmentId, userId } = await eligibleEnrollment(courses.flagship, { name: 'Ada Lindqvist' });
    const now = new Date('2026-12-01T12:00:00Z');
    const outcome = await issueCertificate(enrollmentId, coordinator.id, { now });
    expect(outcome.outcome).toBe('issued');
    const cert = await db().Certificate.findOne({ where: { enrollmentId } });
    expect(cert).not.toBeNull();
    expect(normalizeSerial(cert!.serial)).toBe(cert!.serial);
    expect(cert!.userId).toBe(userId);
    expect(cert!.issuedAt.toISOString()).toBe('2026-12-01T12:00:00.000Z');
    // validityMonths 36 (courses table default, as the course front matter says).
    expect(cert!.validUntil.toISOString()).toBe('2029-12-01T12:00:00.000Z');
    expect((await db().Enrollment.findByPk(enrollmentId))!.status).toBe('completed');
    const auditRow = await db().AuditLog.findOne({ where: { action: 'certificate.issued' } });
    expect(auditRow).toMatchObject({ actorId: coordinator.id, subjectType: 'certificate', subjectId: String(cert!.id) });
    const mail = await db().OutboxEmail.findOne({ where: { kind: 'certificate.issued' } });
    expect(mail!.subject).toContain('Safe Pickling');
    const attachments = mail!.attachments as { filename: string; contentType: string; contentBase64: string }[];
    expect(attachments).toHaveLength(1);
    expect(attachments[0]).toMatchObject({ filename: `certificate-${cert!.serial}.pdf`, contentType: 'application/pdf' });
    const parser = new PDFParse({ data: new Uint8Array(Buffer.from(attachments[0].contentBase64, 'base64')) });
    const { text } = await parser.getText();
    await parser.destroy();
    expect(text).toContain(cert!.serial);
    expect(text).toContain('Ada Lindqvist');
  });

  it('answers "exists" the second time and never makes two', async () => {
    const { enrollmentId } = await eligibleEnrollment(courses.flagship);
    const first = await issueCertificate(enrollmentId, null);
    const second = await issueCertificate(enrollmentId, null);
    expect(first.outcome).toBe('issued');
    expect(second).toMatchObject({ outcome: 'exists', serial: (first as { serial: string }).serial });
    expect(await certificateCount(enrollmentId)).toBe(1);
    expect(await db().OutboxEmail.count()).toBe(1);
  });

  it('gives one certificate when two coordinators issue at the same moment', async () => {
    const [a, b] = [await createUser('coordinator'), await createUser('coordinator')];
    const { enrollmentId } = await eligibleEnrollment(courses.flagship);
    const results = await Promise.all([issueCertificate(enrollmentId, a.id), issueCertificate(enrollmentId, b.id), issueCertificate(enrollmentId, a.id)]);
    expect(results.map((r) => r.outcome).sort()).toEqual(['exists', 'exists', 'issued']);
    expect(await certificateCount(enrollmentId)).toBe(1);
    expect(await db().AuditLog.count({ where: { action: 'certificate.issued' } })).toBe(1);
    expect(await db().OutboxEmail.count({ where: { kind: 'certificate.issued' } })).toBe(1);
  });

  it('the unique key on enrollmentId refuses a second row even past the service', async () => {
    const { enrollmentId, userId } = await eligibleEnrollment(courses.flagship);
    await issueCertificate(enrollmentId, null);
    await expect(
      db().Certificate.create({
        enrollmentId,
        userId,
        issuedById: null,
        serial: 'ZZZZ-ZZZZ-ZZZZ-ZZZZ',
        holderName: 'Twice',
        courseTitle: 'Twice',
        programName: 'Twice',
        issuedAt: new Date(),
        validUntil: new Date(),
      }),
    ).rejects.toMatchObject({ name: 'SequelizeUniqueConstraintError' });
  });

  it('refuses an enrollment that is not eligible, saying what is missing', async () => {
    const { enrollmentId } = await eligibleEnrollment(courses.flagship, { skip: { quizzes: true } });
    expect(await issueCertificate(enrollmentId, null)).toEqual({ enrollmentId, outcome: 'not_eligible', missing: ['quizzes'] });
    expect(await certificateCount(enrollmentId)).toBe(0);
  });

  it('bulk issues through the route for coordinators only, reporting each outcome', async () => {
    const ok = await eligibleEnrollment(courses.flagship);
    const no = await eligibleEnrollment(courses.flagship, { skip: { paid: true } });
    const body = { enrollmentIds: [ok.enrollmentId, no.enrollmentId, 999999] };
    expect((await issueRoute(jsonRequest('/api/desk/certificates', body), {})).status).toBe(401);
    actAs(await createUser('instructor'));
    expect((await issueRoute(jsonRequest('/api/desk/certificates', body), {})).status).toBe(403);
    actAs(await createUser('admin'));
    const response = await issueRoute(jsonRequest('/api/desk/certificates', body), {});
    expect(response.status).toBe(200);
    const json = await response.json();
    expect(json).toMatchObject({ issued: 1, notEligible: 1, notFound: 1, existing: 0 });
    expect((await issueRoute(jsonRequest('/api/desk/certificates', { enrollmentIds: [] }), {})).status).toBe(400);
    expect((await issueRoute(jsonRequest('/api/desk/certificates', { enrollmentIds: ['x'] }), {})).status).toBe(400);
  });

  it('issues many at once with their own transactions', async () => {
    const ids = [];
    for (let i = 0; i < 6; i++) ids.push((await eligibleEnrollment(courses.flagship)).enrollmentId);
    const results = await issueCertificates([...ids, ids[0]], null, { concurrency: 3 });
    expect(results.filter((r) => r.outcome === 'issued')).toHaveLength(6);
    expect(await db().Certificate.count()).toBe(6);
    expect(new Set((await db().Certificate.findAll()).map((c) => c.serial)).size).toBe(6);
  });
});

describe('revoking', () => {
  it('takes a reason, is audited, tells the learner, and shows as revoked', async () => {
    const coordinator = await createUser('coordinator');
    const { enrollmentId } = await eligibleEnrollment(courses.flagship);
    const issued = (await issueCertificate(enrollmentId, coordinator.id)) as { certificateId: number; serial: string };
    actAs(coordinator);
    const url = `/api/desk/certificates/${issued.certificateId}/revoke`;
    const empty = await revokeRoute(jsonRequest(url, { reason: '' }), params({ id: String(issued.certificateId) }));
    expect(empty.status).toBe(400);
    expect((await empty.json()).fields.reason).toBeDefined();
    const ok = await revokeRoute(
      jsonRequest(url, { reason: 'Practical photos were not the learner’s own batch.' }),
      params({ id: String(issued.certificateId) }),
    );
    expect(ok.status).toBe(200);
    const again = await revokeRoute(jsonRequest(url, { reason: 'Second attempt at revoking.' }), params({ id: String(issued.certificateId) }));
    expect(again.status).toBe(409);
    const cert = await db().Certificate.findByPk(issued.certificateId);
    expect(cert!.revokedAt).not.toBeNull();
    expect(cert!.revokeReason).toBe('Practical photos were not the learner’s own batch.');
    expect(await db().AuditLog.count({ where: { action: 'certificate.revoked', actorId: coordinator.id } })).toBe(1);
    expect(await db().OutboxEmail.count({ where: { kind: 'certificate.revoked' } })).toBe(1);
    expect(await verifySerial(issued.serial)).toMatchObject({ found: true, state: 'revoked' });
    const missing = await revokeRoute(jsonRequest('/x', { reason: 'No such certificate here.' }), params({ id: '424242' }));
    expect(missing.status).toBe(404);
  });

  it('is refused to an instructor', async () => {
    const { enrollmentId } = await eligibleEnrollment(courses.flagship);
    const issued = (await issueCertificate(enrollmentId, null)) as { certificateId: number };
    actAs(await createUser('instructor'));
    const response = await revokeRoute(jsonRequest('/x', { reason: 'Not allowed to do this.' }), params({ id: String(issued.certificateId) }));
    expect(response.status).toBe(403);
  });
});

describe('expiry and the refresher', () => {
  it('shows a certificate as expired after its valid-until date', async () => {
    const { enrollmentId } = await eligibleEnrollment(courses.flagship);
    const issued = (await issueCertificate(enrollmentId, null, { now: new Date('2022-01-10T09:00:00Z') })) as { serial: string };
    expect(await verifySerial(issued.serial, new Date('2024-12-31T00:00:00Z'))).toMatchObject({ state: 'valid', validUntil: '2025-01-10T09:00:00.000Z' });
    expect(await verifySerial(issued.serial, new Date('2025-01-10T09:00:01Z'))).toMatchObject({ state: 'expired' });
  });

  it('completing the refresher issues a new certificate that extends the flagship validity', async () => {
    const flagship = await eligibleEnrollment(courses.flagship);
    await issueCertificate(flagship.enrollmentId, null, { now: new Date('2026-01-15T00:00:00Z') }); // valid until 2029-01-15
    const refresher = await eligibleEnrollment(courses.refresher, { userId: flagship.userId, workshopId: null });
    const outcome = await issueCertificate(refresher.enrollmentId, null, { now: new Date('2028-11-01T00:00:00Z') });
    expect(outcome.outcome).toBe('issued');
    const certs = await fetchLearnerCertificates({ userId: flagship.userId, now: new Date('2028-11-01T00:00:00Z') });
    expect(certs).toHaveLength(2);
    const newest = certs[0];
    expect(newest.courseSlug).toBe('volunteer-refresher');
    // Counted from the end of the flagship certificate (2029-01-15) + 36 months.
    expect(newest.validUntil.toISOString()).toBe('2032-01-15T00:00:00.000Z');
  });

  it('refuses the refresher to someone without an earlier certificate', async () => {
    const refresher = await eligibleEnrollment(courses.refresher, { workshopId: null });
    expect(await issueCertificate(refresher.enrollmentId, null)).toMatchObject({ outcome: 'not_eligible', missing: ['prior-certificate'] });
  });
});

describe('claiming the refresher certificate', () => {
  it('lets the learner who completed the refresher issue it, and nobody else or any other course', async () => {
    const flagship = await eligibleEnrollment(courses.flagship, { name: 'Maeve Rourke' });
    await issueCertificate(flagship.enrollmentId, null);
    const refresher = await eligibleEnrollment(courses.refresher, { userId: flagship.userId, workshopId: null });
    const learner = { id: flagship.userId, email: 'maeve@test.example', name: 'Maeve Rourke', roles: ['learner' as const] };
    const claim = (enrollmentId: number) => claimRoute(jsonRequest('/api/certificates/refresher', { enrollmentId }), {});

    actAs(await createUser('learner'));
    expect((await claim(refresher.enrollmentId)).status).toBe(404);
    actAs(learner);
    expect(await claimableRefreshers(learner.id)).toEqual([refresher.enrollmentId]);
    expect((await claim(flagship.enrollmentId)).status).toBe(403);
    const ok = await claim(refresher.enrollmentId);
    expect(ok.status).toBe(201);
    expect((await ok.json()).outcome).toBe('issued');
    expect((await claim(refresher.enrollmentId)).status).toBe(200);
    expect(await certificateCount(refresher.enrollmentId)).toBe(1);
    expect(await claimableRefreshers(learner.id)).toEqual([]);
  });

  it('refuses an unfinished refresher with 409', async () => {
    const flagship = await eligibleEnrollment(courses.flagship);
    await issueCertificate(flagship.enrollmentId, null);
    const refresher = await eligibleEnrollment(courses.refresher, { userId: flagship.userId, workshopId: null, skip: { finalExam: true } });
    actAs({ id: flagship.userId, email: 'x@test.example', name: 'x', roles: ['learner'] });
    const response = await claimRoute(jsonRequest('/api/certificates/refresher', { enrollmentId: refresher.enrollmentId }), {});
    expect(response.status).toBe(409);
    expect((await response.json()).missing).toEqual(['final-exam']);
  });
});

describe('PDF download', () => {
  it('is for the owner and coordinators; others get 404; a revoked one is not given to the learner', async () => {
    const { enrollmentId, userId } = await eligibleEnrollment(courses.flagship, { name: 'Ines Moreau' });
    const issued = (await issueCertificate(enrollmentId, null)) as { serial: string; certificateId: number };
    const call = () => pdfRoute(new Request(`http://localhost/api/certificates/${issued.serial}/pdf`), params({ serial: issued.serial }));
    expect((await call()).status).toBe(401);
    actAs({ id: userId, email: 'x@test.example', name: 'Ines Moreau', roles: ['learner'] });
    const own = await call();
    expect(own.status).toBe(200);
    expect(own.headers.get('content-type')).toBe('application/pdf');
    const parser = new PDFParse({ data: new Uint8Array(await own.arrayBuffer()) });
    expect((await parser.getText()).text).toContain(issued.serial);
    await parser.destroy();
    actAs(await createUser('learner'));
    expect((await call()).status).toBe(404);
    actAs(await createUser('coordinator'));
    expect((await call()).status).toBe(200);
    await db().Certificate.update({ revokedAt: new Date(), revokeReason: 'test' }, { where: { id: issued.certificateId } });
    actAs({ id: userId, email: 'x@test.example', name: 'Ines Moreau', roles: ['learner'] });
    expect((await call()).status).toBe(409);
  });
});

describe('desk table route', () => {
  it('paginates on the server and filters by eligibility, course and status', async () => {
    const coordinator = await createUser('coordinator');
    actAs(coordinator);
    const eligible = [];
    for (let i = 0; i < 3; i++) eligible.push((await eligibleEnrollment(courses.flagship)).enrollmentId);
    const blocked = (await eligibleEnrollment(courses.flagship, { skip: { practical: true, quizzes: true } })).enrollmentId;
    await issueCertificate(eligible[0], coordinator.id);
    const get = async (qs: string) => (await deskRoute(new Request(`http://localhost/api/desk/enrollments?${qs}`), {})).json();
    const page1 = await get('pageSize=5&page=1');
    expect(page1).toMatchObject({ total: 4, pages: 1 });
    const small = await get('pageSize=5&page=1&eligible=yes');
    expect(small.items.map((i: { id: number }) => i.id).sort()).toEqual([eligible[1], eligible[2]].sort());
    const no = await get('eligible=no');
    expect(no.items.map((i: { id: number }) => i.id)).toEqual([blocked]);
    expect(no.items[0].checks.find((c: { key: string }) => c.key === 'practical').met).toBe(false);
    // The quizzes still to pass are named by their titles (content/quizzes), never by slug.
    const quizzes = no.items[0].checks.find((c: { key: string }) => c.key === 'quizzes');
    expect(quizzes.missing.length).toBeGreaterThan(0);
    expect(quizzes.missing).toContain(getBank(requirementsForCourse('pickling-and-canning').quizSlugs[0])!.title);
    for (const name of quizzes.missing) expect(name).not.toMatch(/--/);
    const certified = await get('eligible=certified');
    expect(certified.items.map((i: { id: number }) => i.id)).toEqual([eligible[0]]);
    expect(certified.items[0].certificate.state).toBe('valid');
    expect((await get('status=completed')).total).toBe(1);
    expect((await get('course=volunteer-refresher')).total).toBe(0);
    const paged = await get('pageSize=5&page=2');
    expect(paged.page).toBe(1);
    const bad = await deskRoute(new Request('http://localhost/api/desk/enrollments?status=nope'), {});
    expect(bad.status).toBe(400);
  });
});

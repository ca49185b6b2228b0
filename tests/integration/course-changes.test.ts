import { QueryTypes } from 'sequelize';
import { beforeEach, describe, expect, it } from 'vitest';
import { queueChangeNotices } from '@/lib/changes/notices';
import { loadStandings } from '@/lib/certificates/facts';
import { requirementsForCourse } from '@/lib/certificates/requirements';
import { getChanges, getLessons } from '@/lib/content';
import { publishedBy } from '@/lib/content/changes';
import { getBank } from '@/lib/quiz/bank';
import { questionPool } from '@/lib/quiz/attempts';
import { db } from '@/models';
import { POST as start } from '@/app/api/quizzes/[quiz]/attempts/route';
import { params } from '../support/request';
import { actAs } from '../support/session';
import { drawnOf, enroll } from '../support/quiz-support';
import { createCourses, createUser, resetDatabase } from '../support/db';
import { eligibleEnrollment } from '../support/certificate-fixtures';

const FLAGSHIP = 'pickling-and-canning';
const NEW_LESSON = 'fermented-pickles-and-sauerkraut';

let courses: Awaited<ReturnType<typeof createCourses>>;

beforeEach(async () => {
  await resetDatabase();
  courses = await createCourses();
});

async function certify(enrollmentId: number, userId: number, { revoked = false, validUntil = new Date(Date.now() + 365 * 86_400_000) } = {}) {
  const coordinator = await createUser('coordinator');
  await db().sequelize.query(
    `INSERT INTO certificates (enrollmentId, userId, issuedById, serial, holderName, courseTitle, programName, issuedAt, validUntil, revokedAt, createdAt, updatedAt)
     VALUES (:enrollmentId, :userId, :by, :serial, 'Test holder', 'Test course', 'Test program', NOW(), :validUntil, :revokedAt, NOW(), NOW())`,
    { replacements: { enrollmentId, userId, by: coordinator.id, serial: `BW-TEST-${enrollmentId}`, validUntil, revokedAt: revoked ? new Date() : null } },
  );
}

const outbox = () =>
  db().sequelize.query<{ toAddress: string; kind: string; subject: string; textBody: string }>(
    'SELECT toAddress, kind, subject, textBody FROM outbox_emails ORDER BY id',
    { type: QueryTypes.SELECT },
  );

describe('requirements in force when the enrollment began', () => {
  it('an enrollment of content version 1 is eligible without the fermenting lesson; one of version 2 is not', async () => {
    const v1 = requirementsForCourse(FLAGSHIP, 1);
    const v2 = requirementsForCourse(FLAGSHIP, 2);
    expect(v1.lessonSlugs).toHaveLength(8);
    expect(v1.lessonSlugs).not.toContain(NEW_LESSON);
    expect(v2.lessonSlugs).toEqual(getLessons(FLAGSHIP).map((l) => l.slug));
    expect(v2.quizSlugs).toContain(`${FLAGSHIP}--${NEW_LESSON}`);
    expect(requirementsForCourse(FLAGSHIP)).toEqual(v2);

    const course = { id: courses.flagship.id, slug: FLAGSHIP };
    const older = await eligibleEnrollment(course);
    const newer = await eligibleEnrollment(course);
    await db().Enrollment.update({ contentVersion: 2 }, { where: { id: newer.enrollmentId } });
    // Neither learner has read the new lesson or passed its quiz.
    await db().sequelize.query('DELETE FROM lesson_progress WHERE lessonSlug = :s', { replacements: { s: NEW_LESSON } });
    await db().sequelize.query('DELETE FROM quiz_attempts WHERE quizSlug = :q', { replacements: { q: `${FLAGSHIP}--${NEW_LESSON}` } });

    const standings = await loadStandings([older.enrollmentId, newer.enrollmentId]);
    expect(standings.get(older.enrollmentId)!.eligibility).toMatchObject({ eligible: true, missing: [] });
    const newerStanding = standings.get(newer.enrollmentId)!;
    expect(newerStanding.eligibility.eligible).toBe(false);
    expect(newerStanding.eligibility.missing).toEqual(['lessons', 'quizzes']);
    expect(newerStanding.eligibility.checks.find((c) => c.key === 'lessons')!.missing).toEqual([NEW_LESSON]);
  });
});

describe('the final exam of an enrollment begun before the fermenting lesson', () => {
  it("draws no question of that lesson's quiz; a new enrollment's exam may", async () => {
    const exam = getBank(`${FLAGSHIP}--final-exam`)!;
    const lessonQuiz = getBank(`${FLAGSHIP}--${NEW_LESSON}`)!;
    const newIds = new Set(lessonQuiz.questions.map((q) => q.id));
    expect(questionPool(exam, 2)).toHaveLength(exam.questions.length);
    expect(questionPool(exam, 1)).toHaveLength(exam.questions.length - lessonQuiz.questions.length);
    expect(questionPool(exam, 1).some((q) => newIds.has(q.id))).toBe(false);
    // The lesson's own quiz stays open to anyone enrolled, whatever the version.
    expect(questionPool(lessonQuiz, 1)).toHaveLength(lessonQuiz.questions.length);

    const older = await createUser('learner');
    await enroll(older.id, courses.flagship.id);
    actAs(older);
    const response = await start(new Request('http://localhost/x', { method: 'POST' }), params({ quiz: exam.slug }));
    expect(response.status).toBe(201);
    const { drawn } = await drawnOf((await response.json()).attempt.id);
    expect(drawn.questions).toHaveLength(exam.draw);
    expect(drawn.questions.filter((d) => newIds.has(d.id))).toEqual([]);
  });
});

describe('"what changed" notices to certificate holders', () => {
  it('e-mails each holder of a current certificate once per published entry, never a revoked or expired one', async () => {
    const course = { id: courses.flagship.id, slug: FLAGSHIP };
    const holder = await eligibleEnrollment(course, { email: 'holder@test.example', name: 'Holder' });
    const revoked = await eligibleEnrollment(course, { email: 'revoked@test.example' });
    const expired = await eligibleEnrollment(course, { email: 'expired@test.example' });
    await eligibleEnrollment(course, { email: 'no-certificate@test.example' });
    await certify(holder.enrollmentId, holder.userId);
    await certify(revoked.enrollmentId, revoked.userId, { revoked: true });
    await certify(expired.enrollmentId, expired.userId, { validUntil: new Date(Date.now() - 86_400_000) });

    const flagshipEntries = publishedBy(getChanges(FLAGSHIP)!.changes, new Date());
    const refresherEntries = publishedBy(getChanges('volunteer-refresher')!.changes, new Date());
    expect(flagshipEntries.length).toBeGreaterThan(0);

    const first = await queueChangeNotices();
    expect(first).toEqual({ changes: flagshipEntries.length + refresherEntries.length, emails: 1 });
    const mail = await outbox();
    expect(mail.map((m) => m.toAddress)).toEqual(['holder@test.example']);
    expect(mail[0]).toMatchObject({ kind: 'course.changes', subject: 'What changed in Safe Pickling and Water-Bath Canning' });
    for (const entry of flagshipEntries) expect(mail[0].textBody).toContain(entry.source);
    expect(mail[0].textBody).toContain('/courses/pickling-and-canning/changes');

    // Run again, and twice at once: nothing more is sent.
    expect(await queueChangeNotices()).toEqual({ changes: 0, emails: 0 });
    const racing = await Promise.all([queueChangeNotices(), queueChangeNotices()]);
    expect(racing.map((r) => r.emails)).toEqual([0, 0]);
    expect(await outbox()).toHaveLength(1);
  });

  it('announces nothing dated after today, and two workers racing over new entries send them once', async () => {
    const course = { id: courses.flagship.id, slug: FLAGSHIP };
    const holder = await eligibleEnrollment(course, { email: 'holder2@test.example' });
    await certify(holder.enrollmentId, holder.userId);
    expect(await queueChangeNotices(new Date('2026-01-01T00:00:00Z'))).toEqual({ changes: 0, emails: 0 });
    expect(await outbox()).toHaveLength(0);

    const racing = await Promise.all([queueChangeNotices(), queueChangeNotices()]);
    expect(racing.reduce((n, r) => n + r.emails, 0)).toBe(1);
    expect(await outbox()).toHaveLength(1);
  });
});

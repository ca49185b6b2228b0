import { QueryTypes } from 'sequelize';
import { requirementsForCourse } from '@/lib/certificates/requirements';
import { db } from '@/models';
import { createUser } from './db';

type Course = { id: number; slug: string };

export async function createWorkshop(courseId: number, overrides: Partial<{ attendanceRequired: boolean; startsAt: Date; place: string }> = {}) {
  const startsAt = overrides.startsAt ?? new Date('2026-11-14T16:00:00Z');
  const w = await db().Workshop.create({
    courseId,
    instructorId: null,
    startsAt,
    endsAt: new Date(startsAt.getTime() + 5 * 3_600_000),
    timeZone: 'America/Denver',
    place: overrides.place ?? 'Cedar Hollow Grange Hall, 14 Mill Road',
    seats: 12,
    attendanceRequired: overrides.attendanceRequired ?? true,
  });
  return w.id;
}

export type Done = Partial<{ paid: boolean; lessons: boolean; quizzes: boolean; finalExam: boolean; practical: boolean; attended: boolean }>;

/**
 * A learner with an enrollment in `course` who has done everything the course requires, except
 * what `skip` turns off. Rows are written with plain SQL, as the features that own them would.
 */
export async function eligibleEnrollment(
  course: Course,
  options: { name?: string; email?: string; workshopId?: number | null; skip?: Done; userId?: number; waiver?: boolean } = {},
) {
  const { sequelize } = db();
  const skip = options.skip ?? {};
  const userId = options.userId ?? (await createUser('learner', { name: options.name, email: options.email })).id;
  const now = new Date();
  const workshopId = options.workshopId === undefined ? await createWorkshop(course.id) : options.workshopId;
  let feeWaiverId: number | null = null;
  if (options.waiver) {
    const waiver = await db().FeeWaiver.create({
      code: `WAIVE-${userId}-${course.id}`,
      courseId: course.id,
      createdById: null,
      maxUses: 1,
      expiresAt: new Date(Date.now() + 86_400_000),
    });
    feeWaiverId = waiver.id;
  }
  const enrollment = await db().Enrollment.create({
    userId,
    courseId: course.id,
    workshopId,
    feeWaiverId,
    runKey: workshopId ? String(workshopId) : 'self-paced',
    status: 'active',
    feeCents: 4500,
    attendedAt: skip.attended ? null : now,
  });
  if (!skip.paid && feeWaiverId === null) {
    await sequelize.query(
      `INSERT INTO payments (enrollmentId, provider, checkoutSessionId, amountCents, currency, status, refundedCents, paidAt, createdAt, updatedAt)
       VALUES (:id, 'stripe', :cs, 4500, 'usd', 'paid', 0, :now, :now, :now)`,
      { replacements: { id: enrollment.id, cs: `cs_test_${enrollment.id}_${Math.random().toString(36).slice(2)}`, now } },
    );
  }
  const req = requirementsForCourse(course.slug);
  if (!skip.lessons) {
    for (const lessonSlug of req.lessonSlugs) {
      await sequelize.query(
        'INSERT INTO lesson_progress (userId, courseId, lessonSlug, readAt, createdAt, updatedAt) VALUES (:userId, :courseId, :lessonSlug, :now, :now, :now) ON DUPLICATE KEY UPDATE id = id',
        { replacements: { userId, courseId: course.id, lessonSlug, now } },
      );
    }
  }
  const quizzes = [...(skip.quizzes ? [] : req.quizSlugs), ...(!skip.finalExam && req.finalExam ? [req.finalExam] : [])];
  for (const quizSlug of quizzes) {
    await sequelize.query(
      `INSERT INTO quiz_attempts (userId, courseId, quizSlug, drawn, answers, scorePct, passed, startedAt, submittedAt, createdAt, updatedAt)
       VALUES (:userId, :courseId, :quizSlug, '[]', '{}', 100, 1, :now, :now, :now, :now)`,
      { replacements: { userId, courseId: course.id, quizSlug, now } },
    );
  }
  if (!skip.practical && req.practicalRequired) {
    await sequelize.query(
      `INSERT INTO practicals (enrollmentId, userId, round, status, details, flags, submittedAt, createdAt, updatedAt)
       VALUES (:id, :userId, 1, 'approved', '{}', '[]', :now, :now, :now)`,
      { replacements: { id: enrollment.id, userId, now } },
    );
  }
  return { enrollmentId: enrollment.id, userId, workshopId };
}

export async function certificateCount(enrollmentId: number): Promise<number> {
  const [row] = await db().sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM certificates WHERE enrollmentId = :enrollmentId', {
    replacements: { enrollmentId },
    type: QueryTypes.SELECT,
  });
  return Number(row.n);
}

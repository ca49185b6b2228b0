import 'server-only';
import { QueryTypes } from 'sequelize';
import { AppError } from '@/lib/errors';
import { isEnrolled } from '@/lib/access';
import { getLesson } from '@/lib/content';
import { db } from '@/models';

/** The database id of a course, or a 404. */
export async function courseIdFor(courseSlug: string): Promise<number> {
  const course = await db().Course.findOne({ where: { slug: courseSlug }, attributes: ['id'] });
  if (!course) throw new AppError('not_found', 'There is no course with that name.');
  return course.id;
}

/**
 * Marks a lesson read for a learner. Idempotent: a second call keeps the first reading time.
 * Only learners enrolled in the course keep progress (403 otherwise).
 */
export async function markLessonRead(userId: number, courseSlug: string, lessonSlug: string): Promise<{ readAt: Date; created: boolean }> {
  const courseId = await courseIdFor(courseSlug);
  if (!getLesson(courseSlug, lessonSlug))
    throw new AppError('not_found', 'There is no such lesson in this course.', { fields: { lessonSlug: ['no such lesson'] } });
  if (!(await isEnrolled(userId, courseSlug))) {
    throw new AppError('forbidden', 'Enroll in this course to keep track of the lessons you read.');
  }
  const { sequelize } = db();
  const now = new Date();
  // Raw SQL: INSERT … ON DUPLICATE KEY UPDATE is one statement, safe against two tabs at once (the unique index keeps one row); findOrCreate takes two.
  const [, affected] = (await sequelize.query(
    `INSERT INTO lesson_progress (userId, courseId, lessonSlug, readAt, createdAt, updatedAt)
     VALUES (:userId, :courseId, :lessonSlug, :now, :now, :now)
     ON DUPLICATE KEY UPDATE id = id`,
    { replacements: { userId, courseId, lessonSlug, now }, type: QueryTypes.INSERT },
  )) as unknown as [unknown, number];
  const row = await db().LessonProgress.findOne({ where: { userId, courseId, lessonSlug }, attributes: ['readAt'] });
  return { readAt: row?.readAt ?? now, created: affected === 1 };
}

/** The lessons of a course the learner has read, slug → time read. */
export async function readLessons(userId: number, courseSlug: string): Promise<Record<string, string>> {
  // Raw SQL: a join on the course slug, read as flat rows.
  const rows = await db().sequelize.query<{ lessonSlug: string; readAt: Date }>(
    `SELECT lp.lessonSlug, lp.readAt FROM lesson_progress lp JOIN courses c ON c.id = lp.courseId
      WHERE lp.userId = :userId AND c.slug = :courseSlug`,
    { replacements: { userId, courseSlug }, type: QueryTypes.SELECT },
  );
  return Object.fromEntries(rows.map((r) => [r.lessonSlug, new Date(r.readAt).toISOString()]));
}

/** Quiz slugs of a course the learner has passed at least once. */
export async function passedQuizzes(userId: number, courseSlug: string): Promise<string[]> {
  // Raw SQL: DISTINCT over a join on the course slug, read as flat rows.
  const rows = await db().sequelize.query<{ quizSlug: string }>(
    `SELECT DISTINCT qa.quizSlug FROM quiz_attempts qa JOIN courses c ON c.id = qa.courseId
      WHERE qa.userId = :userId AND c.slug = :courseSlug AND qa.passed = 1 AND qa.submittedAt IS NOT NULL`,
    { replacements: { userId, courseSlug }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => r.quizSlug);
}

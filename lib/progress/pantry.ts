import 'server-only';
import { QueryTypes } from 'sequelize';
import { getCourse, getLessons } from '@/lib/content';
import { lessonsForVersion } from '@/lib/content/versions';
import { db } from '@/models';
import { loadStandings } from '@/lib/certificates/facts';
import { buildShelf, STILL_TO_DO, type Shelf } from './shelf';

type Row = { id: number; courseSlug: string; courseTitle: string; status: Shelf['status']; contentVersion: number };

/**
 * The learner's shelves: one per course they are enrolled in (latest enrollment per course),
 * from three queries whatever the number of courses (enrollments, lessons read, quizzes passed).
 */
export async function fetchPantry(userId: number): Promise<Shelf[]> {
  const { sequelize } = db();
  // Raw SQL: the latest enrollment per course by a correlated subquery, one statement whatever the number of courses.
  const enrollments = await sequelize.query<Row>(
    `SELECT e.id, c.slug AS courseSlug, c.title AS courseTitle, e.status, e.contentVersion
       FROM enrollments e JOIN courses c ON c.id = e.courseId
      WHERE e.userId = :userId
        AND e.id = (SELECT e2.id FROM enrollments e2 WHERE e2.userId = e.userId AND e2.courseId = e.courseId ORDER BY e2.createdAt DESC, e2.id DESC LIMIT 1)
      ORDER BY e.createdAt ASC`,
    { replacements: { userId }, type: QueryTypes.SELECT },
  );
  if (!enrollments.length) return [];
  const [reads, passes, standings] = await Promise.all([
    // Raw SQL: every lesson read, with its course slug, in one flat join.
    sequelize.query<{ courseSlug: string; lessonSlug: string; readAt: Date }>(
      'SELECT c.slug AS courseSlug, lp.lessonSlug, lp.readAt FROM lesson_progress lp JOIN courses c ON c.id = lp.courseId WHERE lp.userId = :userId',
      { replacements: { userId }, type: QueryTypes.SELECT },
    ),
    // Raw SQL: DISTINCT slugs only, without loading attempts.
    sequelize.query<{ quizSlug: string }>('SELECT DISTINCT quizSlug FROM quiz_attempts WHERE userId = :userId AND passed = 1 AND submittedAt IS NOT NULL', {
      replacements: { userId },
      type: QueryTypes.SELECT,
    }),
    loadStandings(enrollments.map((e) => e.id)),
  ]);
  const passed = passes.map((p) => p.quizSlug);
  return enrollments.map((e) => {
    const content = getCourse(e.courseSlug);
    const read: Record<string, string> = {};
    for (const r of reads) if (r.courseSlug === e.courseSlug) read[r.lessonSlug] = new Date(r.readAt).toISOString();
    return buildShelf({
      slug: e.courseSlug,
      title: content?.title ?? e.courseTitle,
      status: e.status,
      finalExam: content?.finalExam ?? null,
      // The jars of the lessons in force when the enrollment began.
      lessons: lessonsForVersion(getLessons(e.courseSlug), Number(e.contentVersion)).map((l) => ({
        slug: l.slug,
        title: l.title,
        order: l.order,
        quiz: l.quiz,
      })),
      read,
      passedQuizzes: passed.filter((q) => q.startsWith(`${e.courseSlug}--`)),
      // What the certificate still needs beyond the jars, named (the desk's own eligibility checks).
      remaining: (standings.get(e.id)?.eligibility.checks ?? [])
        .filter((c) => !c.met && c.key in STILL_TO_DO)
        .map((c) => STILL_TO_DO[c.key as keyof typeof STILL_TO_DO]),
    });
  });
}

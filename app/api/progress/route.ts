import { requireRole } from '@/lib/auth/guard';
import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { MarkReadSchema, ProgressQuerySchema } from '@/lib/validations/progress';
import { markLessonRead, passedQuizzes, readLessons } from '@/lib/progress/store';

/** Marks a lesson read (idempotent). */
export const POST = route(async (request) => {
  const user = await requireRole('learner');
  const input = parseOrThrow(MarkReadSchema, await readJson(request), 'lesson');
  const { readAt, created } = await markLessonRead(user.id, input.courseSlug, input.lessonSlug);
  return Response.json(
    { courseSlug: input.courseSlug, lessonSlug: input.lessonSlug, read: true, readAt: readAt.toISOString() },
    { status: created ? 201 : 200 },
  );
});

/** The signed-in learner's reading and passed quizzes in one course: ?course=<slug>. */
export const GET = route(async (request) => {
  const user = await requireRole('learner');
  const url = new URL(request.url);
  const { course } = parseOrThrow(ProgressQuerySchema, { course: url.searchParams.get('course') ?? '' }, 'query');
  const [read, passed] = await Promise.all([readLessons(user.id, course), passedQuizzes(user.id, course)]);
  return Response.json({ courseSlug: course, read, passedQuizzes: passed });
});

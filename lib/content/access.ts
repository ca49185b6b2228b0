import 'server-only';
import { forbidden, notFound } from 'next/navigation';
import { cache } from 'react';
import { isEnrolled } from '@/lib/access';
import { requirePageRole } from '@/lib/auth/guard';
import type { SessionUser } from '@/lib/auth/users';
import { roleAllows } from '@/lib/roles';
import { getCourse, getLesson, type CourseContent, type LessonContent } from './index';

/**
 * Who may read a members-only lesson: a learner with an active or completed enrollment in the
 * course (the one rule in lib/access.ts), and staff who teach or run the course (instructors and
 * the roles that imply instructor), who review learners' work against these lessons.
 */
export async function canReadMembersLesson(user: Pick<SessionUser, 'id' | 'roles'>, courseSlug: string): Promise<boolean> {
  if (roleAllows(user.roles, ['instructor'])) return true;
  return isEnrolled(user.id, courseSlug);
}

/**
 * The one way to a lesson's body: unknown lessons are a 404, and a members-only lesson first passes
 * the reader's check (sign-in page when signed out, 403 without access). Pages and layouts render
 * in parallel, and a router request may render the page alone, so the page's data needs this check
 * of its own. A preview lesson reads no cookie, so its page stays prerendered. Memoised per request
 * (React `cache`), so the layout and the page share one user and enrollment read.
 */
export const readLesson = cache(async (courseSlug: string, lessonSlug: string): Promise<{ course: CourseContent; lesson: LessonContent }> => {
  const course = getCourse(courseSlug);
  const lesson = getLesson(courseSlug, lessonSlug);
  if (!course || !lesson) notFound();
  if (!lesson.preview) {
    const user = await requirePageRole(`/learn/${course.slug}/${lesson.slug}`);
    if (!(await canReadMembersLesson(user, course.slug))) forbidden();
  }
  return { course, lesson };
});

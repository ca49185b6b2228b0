import 'server-only';
import path from 'node:path';
import { loadChanges, type CourseChanges } from './changes';
import { loadCourses, loadLessons } from './loader';
import type { CourseContent, LessonContent } from './schema';

export { ContentError } from './loader';
export type { CourseContent, LessonContent, LessonSource } from './schema';

/** The content folder of the app (content/ at the project root). */
export const CONTENT_ROOT = path.join(process.cwd(), 'content');

// In production the content is what was deployed with the build: read and validate it once per
// process, so a request never walks the folder. Under `next dev` and in tests, read it on every
// call (the loader still skips files whose mtime and size have not changed), so edits show at once.
const READ_ONCE = process.env.NODE_ENV === 'production';
let coursesOnce: readonly CourseContent[] | undefined;
const lessonsOnce = new Map<string, readonly LessonContent[]>();

/** Every course, flagship first. Throws ContentError (file and field) on a malformed file. */
export function getCourses(): readonly CourseContent[] {
  if (!READ_ONCE) return loadCourses(CONTENT_ROOT);
  coursesOnce ??= loadCourses(CONTENT_ROOT);
  return coursesOnce;
}

/** `{ course }` for every course: the static params of the pages under /courses/[course]. */
export function courseParams(): { course: string }[] {
  return getCourses().map((course) => ({ course: course.slug }));
}

export function getCourse(slug: string): CourseContent | null {
  return getCourses().find((course) => course.slug === slug) ?? null;
}

/** The lessons of a course in order; an unknown course has none. */
export function getLessons(courseSlug: string): readonly LessonContent[] {
  if (!READ_ONCE) return loadLessons(CONTENT_ROOT, courseSlug);
  let lessons = lessonsOnce.get(courseSlug);
  if (!lessons) {
    lessons = loadLessons(CONTENT_ROOT, courseSlug);
    lessonsOnce.set(courseSlug, lessons);
  }
  return lessons;
}

export function getLesson(courseSlug: string, lessonSlug: string): LessonContent | null {
  return getLessons(courseSlug).find((lesson) => lesson.slug === lessonSlug) ?? null;
}

/** The lesson before and after one lesson of its course, for the previous/next links. */
export function getLessonNeighbours(courseSlug: string, lessonSlug: string): { previous: LessonContent | null; next: LessonContent | null } {
  const lessons = getLessons(courseSlug);
  const index = lessons.findIndex((lesson) => lesson.slug === lessonSlug);
  if (index < 0) return { previous: null, next: null };
  return { previous: lessons[index - 1] ?? null, next: lessons[index + 1] ?? null };
}

const changesOnce = new Map<string, CourseChanges | null>();

/** The dated "what changed" record of a course, newest first, or null when it has none. */
export function getChanges(courseSlug: string): CourseChanges | null {
  if (!READ_ONCE) return loadChanges(CONTENT_ROOT, courseSlug);
  if (!changesOnce.has(courseSlug)) changesOnce.set(courseSlug, loadChanges(CONTENT_ROOT, courseSlug));
  return changesOnce.get(courseSlug) ?? null;
}

import 'server-only';
import path from 'node:path';
import { loadCourses, loadLessons } from './loader';
import type { CourseContent, LessonContent } from './schema';

export { ContentError } from './loader';
export type { CourseContent, LessonContent, LessonSource } from './schema';

/** The content folder of the app (content/ at the project root). */
export const CONTENT_ROOT = path.join(process.cwd(), 'content');

/** Every course, flagship first. Throws ContentError (file and field) on a malformed file. */
export function getCourses(): CourseContent[] {
  return loadCourses(CONTENT_ROOT);
}

export function getCourse(slug: string): CourseContent | null {
  return getCourses().find((course) => course.slug === slug) ?? null;
}

/** The lessons of a course in order; an unknown course has none. */
export function getLessons(courseSlug: string): LessonContent[] {
  return loadLessons(CONTENT_ROOT, courseSlug);
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

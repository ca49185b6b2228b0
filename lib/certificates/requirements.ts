import 'server-only';
import { getCourse, getLessons } from '@/lib/content';
import { DEFAULT_REQUIREMENTS, requirementsFromContent } from './catalog';
import type { CourseRequirements } from './eligibility';

const EMPTY = (courseSlug: string): CourseRequirements => ({
  courseSlug,
  lessonSlugs: [],
  quizSlugs: [],
  finalExam: null,
  practicalRequired: false,
  workshopRequired: false,
});

/**
 * What a course requires for its certificate, read from its content (front matter `finalExam`,
 * `workshopRequired`, and every lesson with its `quiz`). When the content has no lessons for the
 * course, the shared course contract (catalog.ts) stands in.
 */
export function requirementsForCourse(courseSlug: string): CourseRequirements {
  const course = getCourse(courseSlug);
  const lessons = course ? getLessons(courseSlug) : [];
  if (course && lessons.length > 0) return requirementsFromContent(course, lessons);
  return DEFAULT_REQUIREMENTS[courseSlug] ?? EMPTY(courseSlug);
}

import 'server-only';
import { getCourse, getLessons } from '@/lib/content';
import { lessonsForVersion } from '@/lib/content/versions';
import { requirementsFromContent } from './catalog';
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
 * `workshopRequired`, and every lesson with its `quiz`). A course with no content files has no
 * lesson, quiz or exam requirements: only the enrollment and fee checks apply to it. With a
 * content version (the enrollment's), only the lessons in force under that version are required;
 * without one, the course's current version applies.
 */
export function requirementsForCourse(courseSlug: string, contentVersion?: number): CourseRequirements {
  const course = getCourse(courseSlug);
  const lessons = course ? lessonsForVersion(getLessons(courseSlug), contentVersion ?? course.version) : [];
  return course && lessons.length > 0 ? requirementsFromContent(course, lessons) : EMPTY(courseSlug);
}

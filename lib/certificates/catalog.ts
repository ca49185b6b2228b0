import type { CourseRequirements } from './eligibility';
import { REFRESHER_COURSE_SLUG } from './validity';

/** Courses whose certificate needs an approved practical batch (the flagship's last lesson is the practical). */
const PRACTICAL_COURSES = new Set(['pickling-and-canning']);

export type ContentCourse = { slug: string; finalExam?: string | null; workshopRequired?: boolean };
export type ContentLesson = { slug: string; quiz?: string | null };

/**
 * What a course requires for its certificate, built from its loaded content (lib/content): every
 * lesson, each lesson's quiz, the final exam from the front matter. The refresher's one quiz is its
 * final exam (content/courses/volunteer-refresher.mdx).
 */
export function requirementsFromContent(course: ContentCourse, lessons: readonly ContentLesson[]): CourseRequirements {
  const quizSlugs = [...new Set(lessons.map((l) => l.quiz).filter((q): q is string => !!q))].filter((q) => q !== course.finalExam);
  return {
    courseSlug: course.slug,
    lessonSlugs: lessons.map((l) => l.slug),
    quizSlugs,
    finalExam: course.finalExam ?? null,
    practicalRequired: PRACTICAL_COURSES.has(course.slug),
    workshopRequired: course.workshopRequired ?? false,
    priorCertificateRequired: course.slug === REFRESHER_COURSE_SLUG,
  };
}

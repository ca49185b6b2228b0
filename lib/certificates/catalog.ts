import type { CourseRequirements } from './eligibility';
import { REFRESHER_COURSE_SLUG } from './validity';

/**
 * What each course requires for its certificate, from the course contract shared by the project
 * (lesson slugs in order, quiz slug per lesson `<course>--<lesson>`, the flagship's final exam and
 * the refresher's single quiz, which is its final exam). `requirementsFromContent` builds the same shape from the course's
 * front matter and lessons once they are loaded (lib/content), and is what the server uses.
 */
const FLAGSHIP_LESSONS = [
  'why-preserving-is-a-safety-job',
  'acidity',
  'salt-sugar-and-water',
  'preparing-produce-and-keeping-it-crisp',
  'jars-packing-and-headspace',
  'processing',
  'cooling-seals-storage-and-spoilage',
  'the-practical-assessment',
];

export const DEFAULT_REQUIREMENTS: Record<string, CourseRequirements> = {
  'pickling-and-canning': {
    courseSlug: 'pickling-and-canning',
    lessonSlugs: FLAGSHIP_LESSONS,
    quizSlugs: FLAGSHIP_LESSONS.map((l) => `pickling-and-canning--${l}`),
    finalExam: 'pickling-and-canning--final-exam',
    practicalRequired: true,
    workshopRequired: true,
  },
  [REFRESHER_COURSE_SLUG]: {
    courseSlug: REFRESHER_COURSE_SLUG,
    lessonSlugs: ['acid-and-ph-review', 'time-and-altitude-review'],
    quizSlugs: [],
    // The refresher's one quiz is its final exam (content/courses/volunteer-refresher.mdx).
    finalExam: 'volunteer-refresher--quiz',
    practicalRequired: false,
    workshopRequired: false,
    priorCertificateRequired: true,
  },
};

/** Courses whose certificate needs an approved practical batch (the flagship's lesson 08 is the practical). */
const PRACTICAL_COURSES = new Set(['pickling-and-canning']);

export type ContentCourse = { slug: string; finalExam?: string | null; workshopRequired?: boolean };
export type ContentLesson = { slug: string; quiz?: string | null };

/** Requirements from loaded course content: every lesson, each lesson's quiz, the final exam. */
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

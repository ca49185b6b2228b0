import { z } from 'zod';

// Front matter of the course and lesson files, checked when content loads. The shapes are the
// shared contract in the project brief: other parts of the product read these fields by name.

const slug = z.string().regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, 'use lowercase letters, digits and single hyphens');
const quizSlug = z.string().regex(/^[a-z0-9]+(?:-[a-z0-9]+)*--[a-z0-9]+(?:-[a-z0-9]+)*$/, 'use "<course>--<name>", lowercase with hyphens');
const text = z.string().trim().min(1, 'must not be empty');

export const sourceSchema = z.object({
  title: text,
  detail: text,
});

export const courseFrontMatterSchema = z
  .object({
    title: text,
    summary: text,
    feeCents: z.number().int().nonnegative(),
    currency: z.literal('usd'),
    passMarkPct: z.number().int().min(1).max(100).default(80),
    validityMonths: z.number().int().positive(),
    requirements: z.array(text).min(1),
    finalExam: quizSlug.optional(),
    workshopRequired: z.boolean(),
    /** The course content version; raised when a change adds a requirement (a new lesson). An enrollment keeps the version it began under. */
    version: z.number().int().positive().default(1),
  })
  .strict();

export const lessonFrontMatterSchema = z
  .object({
    title: text,
    order: z.number().int().positive(),
    minutes: z.number().int().positive(),
    summary: text,
    objectives: z.array(text).min(2, 'list at least 2 learning objectives'),
    quiz: quizSlug,
    preview: z.boolean().default(false),
    /** The course content version from which this lesson is required (enrollments begun earlier are not held to it). */
    since: z.number().int().positive().default(1),
    sources: z.array(sourceSchema).min(1, 'cite at least one published source'),
  })
  .strict();

export type CourseFrontMatter = z.infer<typeof courseFrontMatterSchema>;
export type LessonFrontMatter = z.infer<typeof lessonFrontMatterSchema>;
export type LessonSource = z.infer<typeof sourceSchema>;

export type CourseContent = CourseFrontMatter & { slug: string; body: string; file: string };
export type LessonContent = LessonFrontMatter & { slug: string; courseSlug: string; body: string; file: string };

export { slug as contentSlugSchema };

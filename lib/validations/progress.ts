import { z } from 'zod';

const slug = z
  .string({ error: 'Give a slug.' })
  .trim()
  .min(1, 'Give a slug.')
  .max(120, 'That slug is too long.')
  .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, 'Use lowercase letters, digits and hyphens.');

/** Body of POST /api/progress: the lesson the learner has read. */
export const MarkReadSchema = z.object({ courseSlug: slug, lessonSlug: slug }).strict();
export type MarkReadInput = z.infer<typeof MarkReadSchema>;

/** Query of GET /api/progress. */
export const ProgressQuerySchema = z.object({ course: slug });

export const SlugSchema = slug;

import fs from 'node:fs';
import path from 'node:path';
import matter from 'gray-matter';
import { z } from 'zod';
import { contentSlugSchema } from './schema';

// The dated record of what changed in a course's safety figures and advice:
// content/changes/<course>.md, front matter `changes` (one entry each) and a short introduction.

const text = z.string().trim().min(1, 'must not be empty');
// YAML reads an unquoted 2026-12-04 as a Date; either form becomes the same day string.
const day = z.preprocess((v) => (v instanceof Date ? v.toISOString().slice(0, 10) : v), z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'use YYYY-MM-DD'));

export const changeSchema = z
  .object({
    id: z.string().regex(/^\d{4}-\d{2}-\d{2}-[a-z0-9]+(?:-[a-z0-9]+)*$/, 'use "<date>-<words-with-hyphens>"'),
    date: day,
    kind: z.enum(['figure', 'advice', 'lesson']),
    lesson: contentSlugSchema.optional(),
    summary: text,
    source: text,
  })
  .strict()
  .refine((c) => c.id.startsWith(c.date), { message: 'the id must start with its date', path: ['id'] });

export const changesFileSchema = z.object({ changes: z.array(changeSchema).min(1) }).strict();

export type CourseChange = z.infer<typeof changeSchema> & { courseSlug: string };
export type CourseChanges = { courseSlug: string; intro: string; changes: CourseChange[]; file: string };

/** The changes of one course, newest first; null when the course has no changes file. */
export function loadChanges(root: string, courseSlug: string): CourseChanges | null {
  if (!/^[a-z0-9]+(?:-[a-z0-9]+)*$/.test(courseSlug)) return null;
  const file = path.join(root, 'changes', `${courseSlug}.md`);
  if (!fs.existsSync(file)) return null;
  const shown = path.relative(path.dirname(root), file);
  const parsed = matter(fs.readFileSync(file, 'utf8'), {});
  const result = changesFileSchema.safeParse(parsed.data);
  if (!result.success) {
    const issue = result.error.issues[0];
    throw new Error(`${shown}: front matter field "${issue.path.join('.')}" is not valid: ${issue.message}`);
  }
  const changes = result.data.changes.map((c) => ({ ...c, courseSlug })).sort((a, b) => (a.date === b.date ? 0 : a.date < b.date ? 1 : -1));
  return { courseSlug, intro: parsed.content.trim(), changes, file: shown };
}

/** The entries published by a day (YYYY-MM-DD, UTC): an entry dated later is not announced yet. */
export function publishedBy(changes: readonly CourseChange[], now: Date): CourseChange[] {
  const today = now.toISOString().slice(0, 10);
  return changes.filter((c) => c.date <= today);
}

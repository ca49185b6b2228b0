import fs from 'node:fs';
import path from 'node:path';
import matter from 'gray-matter';
import type { ZodError, ZodType } from 'zod';
import { courseFrontMatterSchema, lessonFrontMatterSchema, type CourseContent, type LessonContent } from './schema';

/** A content file that cannot be used: names the file and the field that is wrong. */
export class ContentError extends Error {
  readonly file: string;
  readonly field: string;

  constructor(file: string, field: string, problem: string) {
    super(`${file}: front matter field "${field}" ${problem}`);
    this.name = 'ContentError';
    this.file = file;
    this.field = field;
  }
}

const LESSON_FILE = /^(\d{2})-([a-z0-9]+(?:-[a-z0-9]+)*)\.mdx$/;
const COURSE_FILE = /^([a-z0-9]+(?:-[a-z0-9]+)*)\.mdx$/;

type Parsed = { data: Record<string, unknown>; body: string };

// Parsed files, keyed by path and checked against the file's mtime and size, so a process reads
// and validates each file once (and again only when it changes, as in `next dev`).
const fileCache = new Map<string, { mtimeMs: number; size: number; parsed: Parsed }>();

function readMatter(absolute: string, shown: string): Parsed {
  const stat = fs.statSync(absolute);
  const hit = fileCache.get(absolute);
  if (hit && hit.mtimeMs === stat.mtimeMs && hit.size === stat.size) return hit.parsed;
  let parsed: Parsed;
  try {
    // Passing options (even empty) keeps gray-matter from caching by content in its own table.
    const result = matter(fs.readFileSync(absolute, 'utf8'), {});
    parsed = { data: result.data as Record<string, unknown>, body: result.content };
  } catch (error) {
    throw new ContentError(shown, '(front matter)', `cannot be read as YAML: ${(error as Error).message}`);
  }
  fileCache.set(absolute, { mtimeMs: stat.mtimeMs, size: stat.size, parsed });
  return parsed;
}

function firstIssue(error: ZodError): { field: string; message: string } {
  const issue = error.issues[0];
  const field = issue.path.length ? issue.path.map(String).join('.') : '(front matter)';
  return { field, message: issue.message };
}

function validate<T>(schema: ZodType<T>, data: unknown, shown: string): T {
  const result = schema.safeParse(data);
  if (!result.success) {
    const { field, message } = firstIssue(result.error);
    throw new ContentError(shown, field, `is not valid: ${message}`);
  }
  return result.data;
}

function relative(root: string, absolute: string) {
  return path.relative(path.dirname(root), absolute) || absolute;
}

function listMdx(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return fs
    .readdirSync(dir)
    .filter((name) => name.endsWith('.mdx'))
    .sort();
}

/** Every course under `<root>/courses`, validated; courses with a workshop first, then by title. */
export function loadCourses(root: string): CourseContent[] {
  const dir = path.join(root, 'courses');
  return listMdx(dir)
    .map((name) => {
      const absolute = path.join(dir, name);
      const shown = relative(root, absolute);
      const match = COURSE_FILE.exec(name);
      if (!match) throw new ContentError(shown, '(file name)', 'is not valid: name course files "<course-slug>.mdx"');
      const { data, body } = readMatter(absolute, shown);
      const front = validate(courseFrontMatterSchema, data, shown);
      return { ...front, slug: match[1], body, file: shown };
    })
    .sort((a, b) => (a.workshopRequired === b.workshopRequired ? a.title.localeCompare(b.title) : a.workshopRequired ? -1 : 1));
}

/** The lessons of one course under `<root>/lessons/<course>`, validated, sorted by order. */
export function loadLessons(root: string, courseSlug: string): LessonContent[] {
  if (!COURSE_FILE.test(`${courseSlug}.mdx`)) return [];
  const dir = path.join(root, 'lessons', courseSlug);
  const lessons = listMdx(dir).map((name) => {
    const absolute = path.join(dir, name);
    const shown = relative(root, absolute);
    const match = LESSON_FILE.exec(name);
    if (!match) throw new ContentError(shown, '(file name)', 'is not valid: name lesson files "NN-<lesson-slug>.mdx"');
    const { data, body } = readMatter(absolute, shown);
    const front = validate(lessonFrontMatterSchema, data, shown);
    if (front.order !== Number(match[1])) {
      throw new ContentError(shown, 'order', `is not valid: it is ${front.order} but the file name starts with ${match[1]}`);
    }
    return { ...front, slug: match[2], courseSlug, body, file: shown };
  });
  const seen = new Map<string, string>();
  for (const lesson of lessons) {
    const other = seen.get(String(lesson.order));
    if (other) throw new ContentError(lesson.file, 'order', `is not valid: ${lesson.order} is also used by ${other}`);
    seen.set(String(lesson.order), lesson.file);
  }
  return lessons.sort((a, b) => a.order - b.order);
}

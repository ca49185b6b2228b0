// The members-only lessons of every course, read from the lesson files' front matter for the
// router's rewrites in next.config.mjs (which loads before TypeScript, so it cannot use the
// validated loader in lib/content). A lesson is members-only unless its front matter says
// `preview: true`, the same default as lib/content/schema.ts; lib/content/members-lesson-routes.test.ts
// checks that this list and the validated loader agree.
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import matter from 'gray-matter';

const LESSON_FILE = /^\d{2}-([a-z0-9]+(?:-[a-z0-9]+)*)\.mdx$/;

/**
 * @param {string} [root] the content folder
 * @returns {{ course: string, lessons: string[] }[]} courses (by slug) with at least one members-only lesson
 */
export function membersLessonRoutes(root = path.join(path.dirname(fileURLToPath(import.meta.url)), '../../content')) {
  const dir = path.join(root, 'lessons');
  if (!fs.existsSync(dir)) return [];
  return fs
    .readdirSync(dir, { withFileTypes: true })
    .filter((entry) => entry.isDirectory() && /^[a-z0-9]+(?:-[a-z0-9]+)*$/.test(entry.name))
    .map((entry) => entry.name)
    .sort()
    .map((course) => ({
      course,
      lessons: fs
        .readdirSync(path.join(dir, course))
        .sort()
        .flatMap((name) => {
          const match = LESSON_FILE.exec(name);
          if (!match) return [];
          const { data } = matter(fs.readFileSync(path.join(dir, course, name), 'utf8'));
          return data.preview === true ? [] : [match[1]];
        }),
    }))
    .filter(({ lessons }) => lessons.length > 0);
}

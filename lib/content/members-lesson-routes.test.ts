import path from 'node:path';
import { describe, expect, it } from 'vitest';
import nextConfig from '../../next.config.mjs';
import { loadCourses, loadLessons } from './loader';
import { membersLessonRoutes } from './members-lesson-routes.mjs';

const root = path.join(__dirname, '../../content');

describe('the members-only lesson rewrites', () => {
  it('list exactly the lessons the validated loader says are not previews, course by course', () => {
    const expected = loadCourses(root)
      .map((course) => ({
        course: course.slug,
        lessons: loadLessons(root, course.slug)
          .filter((l) => !l.preview)
          .map((l) => l.slug),
      }))
      .filter(({ lessons }) => lessons.length > 0)
      .sort((a, b) => a.course.localeCompare(b.course));
    expect(membersLessonRoutes(root)).toEqual(expected);
    // The flagship course has both kinds, so the list is not everything or nothing.
    const flagship = loadLessons(root, 'pickling-and-canning');
    const members = membersLessonRoutes(root).find((c) => c.course === 'pickling-and-canning')!.lessons;
    expect(members.length).toBeGreaterThan(0);
    expect(members.length).toBeLessThan(flagship.length);
  });

  it('treat a lesson without `preview` as members-only, like the schema', () => {
    // The fixture lesson has no preview field (its other fields are what the fixture is about).
    expect(membersLessonRoutes(path.join(__dirname, '__fixtures__', 'wrong-order'))).toEqual([{ course: 'sample-course', lessons: ['numbered-three'] }]);
    expect(membersLessonRoutes(path.join(__dirname, '__fixtures__', 'no-such-folder'))).toEqual([]);
  });

  it('are afterFiles rewrites (decided before the dynamic lesson route) that match members-only lessons only', async () => {
    const rewrites = (await nextConfig.rewrites!()) as { afterFiles: { source: string; destination: string }[] };
    const matches = (pathname: string) =>
      rewrites.afterFiles.some(({ source }) => {
        const m = /^\/learn\/([^/]+)\/:lesson\(([^)]+)\)$/.exec(source);
        if (!m) throw new Error(`unexpected source ${source}`);
        const [, course, lessons] = m;
        return new RegExp(`^/learn/${course}/(?:${lessons})$`).test(pathname);
      });
    for (const course of loadCourses(root)) {
      for (const lesson of loadLessons(root, course.slug)) {
        expect(matches(`/learn/${course.slug}/${lesson.slug}`), `${course.slug}/${lesson.slug}`).toBe(!lesson.preview);
      }
    }
    expect(matches('/learn/pickling-and-canning/processing-extra')).toBe(false);
    expect(rewrites.afterFiles.every((r) => r.destination.endsWith('/:lesson/members'))).toBe(true);
  });
});

import path from 'node:path';
import { loadCourses, loadLessons } from './loader';

// Read by proxy.ts, which runs before routing and cannot import server-only modules.

type Kind = 'preview' | 'members';
let memo: Map<string, Kind> | null = null;

function lessonKinds(): Map<string, Kind> {
  // Content is fixed once the app is built; in development it is re-read (the loader caches by mtime).
  if (memo && process.env.NODE_ENV === 'production') return memo;
  const root = path.join(process.cwd(), 'content');
  const kinds = new Map<string, Kind>();
  for (const course of loadCourses(root)) {
    for (const lesson of loadLessons(root, course.slug)) kinds.set(`${course.slug}/${lesson.slug}`, lesson.preview ? 'preview' : 'members');
  }
  memo = kinds;
  return kinds;
}

/** 'preview' for a public lesson, 'members' for one that needs an enrollment, null when there is no such lesson. */
export function lessonKind(courseSlug: string, lessonSlug: string): Kind | null {
  return lessonKinds().get(`${courseSlug}/${lessonSlug}`) ?? null;
}

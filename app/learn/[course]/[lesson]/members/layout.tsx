import type { ReactNode } from 'react';
import { readLesson } from '@/lib/content/access';

// Members-only lessons (a rewrite in next.config.mjs sends them here, keeping the address). This
// layout sits above the page's loading boundary, so its check answers before the response starts
// streaming: a real redirect to the sign-in page, or a real 403 (../forbidden.tsx). The page checks
// again through the same data function: the layout is not the boundary.
export default async function LessonAccessLayout({ children, params }: { children: ReactNode; params: Promise<{ course: string; lesson: string }> }) {
  const { course, lesson } = await params;
  await readLesson(course, lesson);
  return children;
}

import { forbidden, notFound } from 'next/navigation';
import type { ReactNode } from 'react';
import { requirePageRole } from '@/lib/auth/guard';
import { getLesson } from '@/lib/content';
import { canReadMembersLesson } from '@/lib/content/access';

// Members-only lessons (a rewrite in next.config.mjs sends them here, keeping the address). The access check sits in
// this layout, above the page's loading boundary, so it runs before the response starts
// streaming: a signed-out visitor gets a real redirect to the sign-in page, and a learner without
// an enrollment a real 403 rendered by ../forbidden.tsx.
export default async function LessonAccessLayout({ children, params }: { children: ReactNode; params: Promise<{ course: string; lesson: string }> }) {
  const { course, lesson: lessonSlug } = await params;
  const lesson = getLesson(course, lessonSlug);
  if (!lesson) notFound();
  if (!lesson.preview) {
    const user = await requirePageRole(`/learn/${course}/${lessonSlug}`);
    if (!(await canReadMembersLesson(user, course))) forbidden();
  }
  return children;
}

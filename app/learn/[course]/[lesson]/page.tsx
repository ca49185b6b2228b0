import { LessonView, lessonMetadata, type LessonPageProps } from '@/components/lessons/lesson-view';

// Every lesson, preview or members-only, at one address. Rendered per request and never cached by
// Next: the access decision (readLesson, in LessonView's data path) is made for each reader, so no
// one's refusal or body can be served to another. No loading boundary here, so a refusal is a real
// redirect or 403 before anything streams. Cache-Control for visitors: next.config.mjs.
export const dynamic = 'force-dynamic';

export const generateMetadata = lessonMetadata;

export default async function LessonPage({ params }: LessonPageProps) {
  const { course, lesson } = await params;
  return <LessonView courseSlug={course} lessonSlug={lesson} />;
}

import { LessonView, lessonMetadata, type LessonPageProps } from '@/components/lessons/lesson-view';

// Members-only lessons, rendered per request (LessonView checks access, as ./layout.tsx does); the URL the
// learner sees stays /learn/<course>/<lesson> (next.config.mjs rewrites to here).
export const generateMetadata = lessonMetadata;

export default async function MembersLessonPage({ params }: LessonPageProps) {
  const { course, lesson } = await params;
  return <LessonView courseSlug={course} lessonSlug={lesson} />;
}

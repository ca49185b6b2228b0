import { LessonView, lessonMetadata, type LessonPageProps } from '@/components/lessons/lesson-view';
import { getCourses, getLessons } from '@/lib/content';

// Public preview lessons: static pages generated at build time, served from the cache. Members-only
// lessons never reach this route: next.config.mjs rewrites each of them (to ./members, which checks
// the session and the enrollment) without changing the address. Any other lesson answers 404 here.
export const dynamicParams = false;

export function generateStaticParams() {
  return getCourses().flatMap((course) =>
    getLessons(course.slug)
      .filter((lesson) => lesson.preview)
      .map((lesson) => ({ course: course.slug, lesson: lesson.slug })),
  );
}

export const generateMetadata = lessonMetadata;

export default async function PreviewLessonPage({ params }: LessonPageProps) {
  const { course, lesson } = await params;
  return <LessonView courseSlug={course} lessonSlug={lesson} />;
}

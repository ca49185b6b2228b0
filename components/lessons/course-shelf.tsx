import Link from 'next/link';
import { Jar } from '@/components/pantry/jar';
import type { LessonContent } from '@/lib/content';

/**
 * A course's lessons as the Pantry's shelf of jars, each jar empty (the course page is the same for
 * everyone; a learner's own jars fill in the Pantry), with who may open the lesson, and a fold with
 * what each lesson covers (its public summary, also the lesson page's description).
 */
export function CourseShelf({ courseSlug, lessons }: { courseSlug: string; lessons: readonly LessonContent[] }) {
  return (
    <>
      <ol className="flex flex-wrap items-start gap-x-4 gap-y-6 rounded-jar border border-brine-100 bg-white px-4 pt-4 pb-1 shadow-shelf" aria-label="Lessons">
        {lessons.map((lesson) => {
          const access = lesson.preview ? 'open to everyone' : 'after you enroll';
          return (
            <li key={lesson.slug} className="flex w-28 flex-col items-center border-b-8 border-copper-700/70 pb-2 text-center" data-lesson={lesson.slug}>
              <Link
                href={`/learn/${courseSlug}/${lesson.slug}`}
                className="flex flex-col items-center rounded-lg no-underline focus-visible:outline-2 focus-visible:outline-copper-500"
              >
                <Jar fill={0} label={`Lesson ${lesson.order}: ${lesson.title}, ${access}`} />
                <span className="mt-1 text-xs leading-tight font-semibold text-brine-800 underline underline-offset-2" aria-hidden="true">
                  {lesson.order}. {lesson.title}
                </span>
              </Link>
              <span className={lesson.preview ? 'mt-1 text-xs font-semibold text-copper-700' : 'mt-1 text-xs text-ink-soft'}>{access}</span>
            </li>
          );
        })}
      </ol>
      <details className="max-w-prose text-sm">
        <summary className="cursor-pointer font-semibold text-brine-800">What each lesson covers</summary>
        <dl className="mt-2 space-y-2">
          {lessons.map((lesson) => (
            <div key={lesson.slug}>
              <dt className="font-semibold">
                {lesson.order}. {lesson.title}
              </dt>
              <dd className="text-ink-soft">{lesson.summary}</dd>
            </div>
          ))}
        </dl>
      </details>
    </>
  );
}

import type { Metadata } from 'next';
import Link from 'next/link';
import { LessonPager, Objectives, SourcesList } from '@/components/lessons/lesson-parts';
import { TableOfContents } from '@/components/lessons/table-of-contents';
import { mdxComponents } from '@/components/mdx';
import { LessonActions } from '@/components/progress/lesson-actions';
import { Badge } from '@/components/ui/badge';
import { getLesson, getLessonNeighbours, getLessons } from '@/lib/content';
import { readLesson } from '@/lib/content/access';
import { formatMinutes } from '@/lib/content/format';
import { compileContent } from '@/lib/content/mdx';

export type LessonPageProps = { params: Promise<{ course: string; lesson: string }> };

/** Title and description of a lesson page, for generateMetadata. */
export async function lessonMetadata({ params }: LessonPageProps): Promise<Metadata> {
  const { course, lesson: slug } = await params;
  const lesson = getLesson(course, slug);
  return lesson ? { title: lesson.title, description: lesson.summary } : {};
}

/** A lesson page: header, objectives, the compiled MDX (cached per process), sources, actions, previous/next, contents. */
export async function LessonView({ courseSlug, lessonSlug }: { courseSlug: string; lessonSlug: string }) {
  // The reader's check sits here, in the data path of the lesson body, for every route that shows one.
  const { course, lesson } = await readLesson(courseSlug, lessonSlug);
  const { previous, next } = getLessonNeighbours(courseSlug, lessonSlug);
  const total = getLessons(courseSlug).length;
  const { content, toc } = await compileContent({ file: lesson.file, body: lesson.body, components: mdxComponents });

  return (
    <div data-lesson-page className="grid gap-10 lg:grid-cols-[minmax(0,1fr)_15rem]">
      <article data-lesson className="min-w-0 max-w-prose space-y-8 lg:max-w-3xl">
        <header className="space-y-3">
          <p className="text-sm font-semibold tracking-wide text-copper-700 uppercase">
            <Link href={`/courses/${course.slug}`} className="text-copper-700 no-underline hover:underline">
              {course.title}
            </Link>
            <span aria-hidden="true"> · </span>
            <span>
              Lesson {lesson.order} of {total}
            </span>
          </p>
          <h1 className="text-3xl leading-tight font-bold md:text-4xl">{lesson.title}</h1>
          <p className="text-lg text-ink-soft">{lesson.summary}</p>
          <p className="flex flex-wrap items-center gap-2 text-sm text-ink-soft">
            <span>About {formatMinutes(lesson.minutes)} to read</span>
            {lesson.preview ? <Badge tone="copper">Open to everyone</Badge> : null}
          </p>
        </header>
        {/* On narrow screens the contents come after the title, not above it; the side column holds them on wide ones. */}
        <div className="lg:hidden" data-no-print>
          <TableOfContents entries={toc} className="rounded-jar border border-brine-100 bg-white p-4" />
        </div>
        <Objectives objectives={lesson.objectives} />
        <div data-lesson-body>{content}</div>
        <SourcesList sources={lesson.sources} />
        <div data-no-print>
          <LessonActions courseSlug={course.slug} lessonSlug={lesson.slug} quizSlug={lesson.quiz} />
        </div>
        <LessonPager courseSlug={course.slug} previous={previous} next={next} />
      </article>
      <aside className="hidden lg:block">
        <div className="lg:sticky lg:top-6">
          <TableOfContents entries={toc} />
        </div>
      </aside>
    </div>
  );
}

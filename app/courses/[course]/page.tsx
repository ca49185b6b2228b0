import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { CourseWorkshops } from '@/components/enrollment/course-workshops';
import { mdxComponents } from '@/components/mdx';
import { CourseShelf } from '@/components/lessons/course-shelf';
import { ButtonLink } from '@/components/ui/button';
import { courseParams, getCourse, getLessons } from '@/lib/content';
import { formatFee } from '@/lib/content/format';
import { requirementText } from '@/lib/content/versions';
import { compileContent } from '@/lib/content/mdx';

type Props = { params: Promise<{ course: string }> };

export const dynamicParams = false;

export const generateStaticParams = courseParams;

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const course = getCourse((await params).course);
  return course ? { title: course.title, description: course.summary } : {};
}

export default async function CoursePage({ params }: Props) {
  const course = getCourse((await params).course);
  if (!course) notFound();
  const lessons = getLessons(course.slug);
  const { content } = await compileContent({ file: course.file, body: course.body, components: mdxComponents });
  const first = lessons[0];
  return (
    <div className="space-y-10">
      <header className="space-y-3">
        <p className="text-sm font-semibold tracking-wide text-copper-700 uppercase">
          <Link href="/courses" className="text-copper-700 no-underline hover:underline">
            Courses
          </Link>
        </p>
        <h1 className="text-3xl leading-tight font-bold md:text-4xl">{course.title}</h1>
        <p className="max-w-prose text-lg text-ink-soft">{course.summary}</p>
        {first ? (
          <ButtonLink href={`/learn/${course.slug}/${first.slug}`}>
            {first.preview ? 'Read the first lesson, open to everyone' : 'Start the first lesson'}
          </ButtonLink>
        ) : null}
      </header>
      <section aria-labelledby="lessons-heading" className="space-y-3">
        <h2 id="lessons-heading" className="text-2xl font-bold">
          The course&apos;s shelf
        </h2>
        {lessons.length === 0 ? (
          <p className="text-ink-soft">The lessons of this course are being written.</p>
        ) : (
          <>
            <p className="max-w-prose text-sm text-ink-soft">
              One jar for each lesson. The jars fill on your own Pantry shelf as you read each lesson and pass its quiz.
            </p>
            <CourseShelf courseSlug={course.slug} lessons={lessons} />
          </>
        )}
      </section>
      <div className="max-w-prose">{content}</div>
      {/* The fee sits with the workshop dates it is paid for. */}
      <div id="workshops" className="scroll-mt-6 space-y-4">
        <section aria-label="Course fee" className="max-w-prose rounded-jar border-l-4 border-copper-500 bg-copper-50 px-4 py-3">
          <p>
            <span className="font-semibold">Course fee: {formatFee(course.feeCents, course.currency)}</span>, paid when you choose a workshop date below (or
            covered by a fee waiver code from your program).
          </p>
        </section>
        <CourseWorkshops courseSlug={course.slug} />
      </div>
      <section aria-labelledby="requirements-heading" className="max-w-prose space-y-2">
        <h2 id="requirements-heading" className="text-2xl font-bold">
          To earn the certificate
        </h2>
        <ul className="list-disc space-y-1.5 pl-5">
          {course.requirements.map((requirement) => (
            <li key={requirement}>{requirementText(requirement, lessons.length)}</li>
          ))}
        </ul>
        <p className="text-sm text-ink-soft">
          Quizzes pass at {course.passMarkPct}%. The certificate is valid for {course.validityMonths} months.
        </p>
        <p className="text-sm">
          <Link href={`/courses/${course.slug}/changes`}>What changed in this course</Link>
        </p>
      </section>
    </div>
  );
}

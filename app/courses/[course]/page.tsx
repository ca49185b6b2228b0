import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { CourseWorkshops } from '@/components/enrollment/course-workshops';
import { mdxComponents } from '@/components/mdx';
import { Badge } from '@/components/ui/badge';
import { ButtonLink } from '@/components/ui/button';
import { courseParams, getCourse, getLessons } from '@/lib/content';
import { formatFee, formatMinutes } from '@/lib/content/format';
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
    <div className="grid gap-10 lg:grid-cols-[minmax(0,1fr)_20rem]">
      <div className="min-w-0 space-y-8">
        <header className="space-y-3">
          <p className="text-sm font-semibold tracking-wide text-copper-700 uppercase">
            <Link href="/courses" className="text-copper-700 no-underline hover:underline">
              Courses
            </Link>
          </p>
          <h1 className="text-3xl leading-tight font-bold md:text-4xl">{course.title}</h1>
          <p className="max-w-prose text-lg text-ink-soft">{course.summary}</p>
          {first ? (
            <ButtonLink href={`/learn/${course.slug}/${first.slug}`}>{first.preview ? 'Read the first lesson free' : 'Start the first lesson'}</ButtonLink>
          ) : null}
        </header>
        <div className="max-w-prose">{content}</div>
        <section aria-labelledby="lessons-heading" className="space-y-3">
          <h2 id="lessons-heading" className="text-2xl font-bold">
            Lessons
          </h2>
          {lessons.length === 0 ? (
            <p className="text-ink-soft">The lessons of this course are being written.</p>
          ) : (
            <ol className="divide-y divide-brine-100 rounded-jar border border-brine-100 bg-white">
              {lessons.map((lesson) => (
                <li key={lesson.slug} className="flex flex-wrap items-baseline gap-x-3 gap-y-1 px-4 py-3">
                  <span className="w-6 font-display font-bold text-copper-600" aria-hidden="true">
                    {lesson.order}
                  </span>
                  <span className="min-w-0 flex-1">
                    <Link href={`/learn/${course.slug}/${lesson.slug}`} className="font-semibold">
                      {lesson.title}
                    </Link>
                    <span className="block text-sm text-ink-soft">{lesson.summary}</span>
                  </span>
                  <span className="text-sm text-ink-soft">{formatMinutes(lesson.minutes)}</span>
                  {lesson.preview ? <Badge tone="copper">Free preview</Badge> : <Badge>Enrolled learners</Badge>}
                </li>
              ))}
            </ol>
          )}
        </section>
        <div id="workshops" className="scroll-mt-6">
          <CourseWorkshops courseSlug={course.slug} />
        </div>
      </div>
      <aside className="space-y-6 lg:sticky lg:top-6 lg:self-start">
        <section aria-labelledby="fee-heading" className="rounded-jar border border-brine-100 bg-white p-5 shadow-shelf">
          <h2 id="fee-heading" className="text-lg font-bold">
            Course fee
          </h2>
          <p className="mt-1 font-display text-3xl font-bold text-brine-800">{formatFee(course.feeCents, course.currency)}</p>
          <p className="mt-1 text-sm text-ink-soft">
            Pass mark {course.passMarkPct}% · certificate valid {course.validityMonths} months
          </p>
        </section>
        <section aria-labelledby="requirements-heading" className="rounded-jar border border-brine-100 bg-white p-5 shadow-shelf">
          <h2 id="requirements-heading" className="mb-2 text-lg font-bold">
            To earn the certificate
          </h2>
          <ul className="list-disc space-y-1.5 pl-5 text-sm">
            {course.requirements.map((requirement) => (
              <li key={requirement}>{requirementText(requirement, lessons.length)}</li>
            ))}
          </ul>
          <p className="mt-3 text-sm">
            <Link href={`/courses/${course.slug}/changes`}>What changed in this course</Link>
          </p>
        </section>
      </aside>
    </div>
  );
}

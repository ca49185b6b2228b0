import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { Badge } from '@/components/ui/badge';
import { courseParams, getChanges, getCourse, getLesson } from '@/lib/content';
import { publishedBy } from '@/lib/content/changes';

type Props = { params: Promise<{ course: string }> };

export const dynamicParams = false;

export const generateStaticParams = courseParams;

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const course = getCourse((await params).course);
  return course
    ? { title: `What changed: ${course.title}`, description: `Dated changes to the safety figures and advice of ${course.title}, each with its source.` }
    : {};
}

const KIND_LABEL = { figure: 'Safety figure', advice: 'Advice', lesson: 'New lesson' } as const;

const formatDay = (day: string) => new Intl.DateTimeFormat('en-US', { dateStyle: 'long', timeZone: 'UTC' }).format(new Date(`${day}T00:00:00Z`));

// A static page, built with the content it lists: an entry dated after the build shows from the next deploy.
export default async function CourseChangesPage({ params }: Props) {
  const course = getCourse((await params).course);
  if (!course) notFound();
  const record = getChanges(course.slug);
  const changes = record ? publishedBy(record.changes, new Date()) : [];
  return (
    <div className="max-w-prose space-y-6">
      <header className="space-y-2">
        <p className="text-sm font-semibold tracking-wide text-copper-700 uppercase">
          <Link href={`/courses/${course.slug}`} className="text-copper-700 no-underline hover:underline">
            {course.title}
          </Link>
        </p>
        <h1 className="text-3xl leading-tight font-bold">What changed in this course</h1>
        <p className="text-ink-soft">
          {record?.intro ?? 'Changes to the safety figures and advice of this course are listed here, dated, with their sources.'}
        </p>
      </header>
      {changes.length === 0 ? (
        <p>No changes have been published for this course yet.</p>
      ) : (
        <ol className="space-y-4" aria-label="Changes, newest first">
          {changes.map((change) => {
            const lesson = change.lesson ? getLesson(course.slug, change.lesson) : null;
            return (
              <li key={change.id} id={change.id} className="rounded-jar border border-brine-100 bg-white p-4 shadow-shelf">
                <p className="flex flex-wrap items-center gap-2 text-sm text-ink-soft">
                  <time dateTime={change.date}>{formatDay(change.date)}</time>
                  <Badge tone={change.kind === 'figure' ? 'copper' : undefined}>{KIND_LABEL[change.kind]}</Badge>
                  {lesson ? (
                    <Link href={`/learn/${course.slug}/${lesson.slug}`}>
                      Lesson {lesson.order}: {lesson.title}
                    </Link>
                  ) : null}
                </p>
                <p className="mt-2">{change.summary}</p>
                <p className="mt-2 text-sm text-ink-soft">Source: {change.source}</p>
              </li>
            );
          })}
        </ol>
      )}
      <p className="text-sm text-ink-soft">
        Brinewright checks arithmetic and never calls a recipe safe. Follow tested recipes from a recognised food-safety authority and your local guidance.
      </p>
    </div>
  );
}

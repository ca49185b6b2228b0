import Link from 'next/link';
import type { LessonSource } from '@/lib/content/schema';

type LessonLink = { slug: string; title: string; order: number } | null;

/** What the learner should be able to do after the lesson. */
export function Objectives({ objectives }: { objectives: string[] }) {
  return (
    <section aria-labelledby="objectives-heading" className="rounded-jar border border-brine-100 bg-brine-50 px-5 py-4">
      <h2 id="objectives-heading" className="mb-2 font-display text-lg font-bold text-brine-900">
        After this lesson you can
      </h2>
      <ul className="list-disc space-y-1 pl-6 marker:text-brine-500">
        {objectives.map((objective) => (
          <li key={objective}>{objective}</li>
        ))}
      </ul>
    </section>
  );
}

/** The published sources the lesson cites. */
export function SourcesList({ sources }: { sources: LessonSource[] }) {
  return (
    <section aria-labelledby="sources-heading" className="border-t border-brine-100 pt-6">
      <h2 id="sources-heading" className="mb-3 font-display text-lg font-bold text-brine-900">
        Sources
      </h2>
      <ol className="list-decimal space-y-2 pl-6 text-sm text-ink-soft">
        {sources.map((source) => (
          <li key={`${source.title}|${source.detail}`}>
            <cite className="font-semibold text-ink not-italic">{source.title}</cite>. {source.detail}
          </li>
        ))}
      </ol>
    </section>
  );
}

/** Previous and next lesson of the course. */
export function LessonPager({ courseSlug, previous, next }: { courseSlug: string; previous: LessonLink; next: LessonLink }) {
  if (!previous && !next) return null;
  return (
    <nav aria-label="Previous and next lesson" data-lesson-nav className="grid gap-3 sm:grid-cols-2">
      {previous ? (
        <Link
          href={`/learn/${courseSlug}/${previous.slug}`}
          className="rounded-jar border border-brine-100 bg-white p-4 no-underline shadow-shelf hover:border-brine-300"
        >
          <span className="block text-xs font-semibold tracking-wide text-ink-soft uppercase">Previous: lesson {previous.order}</span>
          <span className="font-display font-bold text-brine-800">{previous.title}</span>
        </Link>
      ) : (
        <span />
      )}
      {next ? (
        <Link
          href={`/learn/${courseSlug}/${next.slug}`}
          className="rounded-jar border border-brine-100 bg-white p-4 text-right no-underline shadow-shelf hover:border-brine-300"
        >
          <span className="block text-xs font-semibold tracking-wide text-ink-soft uppercase">Next: lesson {next.order}</span>
          <span className="font-display font-bold text-brine-800">{next.title}</span>
        </Link>
      ) : null}
    </nav>
  );
}

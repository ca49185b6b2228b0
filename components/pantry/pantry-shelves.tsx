'use client';

import Link from 'next/link';
import useSWR from 'swr';
import { fetchJson, type FetchError } from '@/lib/fetcher';
import { Badge } from '@/components/ui/badge';
import { Button, ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import type { Shelf } from '@/lib/progress/shelf';
import { Jar } from './jar';

/** A shelf-sized stand-in while the shelves load: one shelf of nine empty jars, so the page below keeps its place. */
function ShelfPlaceholder() {
  return (
    <div role="status" aria-busy="true" className="rounded-jar border border-brine-100 bg-white p-5 shadow-shelf">
      <p className="mb-4 text-ink-soft">Opening your Pantry…</p>
      <div className="flex flex-wrap items-start gap-x-4 gap-y-6 border-b-8 border-copper-700/70 pb-1" aria-hidden="true">
        {Array.from({ length: 9 }, (_, i) => (
          <div key={i} className="flex w-24 flex-col items-center">
            <div className="h-28 w-20 animate-pulse rounded-jar bg-paper-deep" />
            <div className="mt-1 h-8 w-20 rounded bg-paper-deep" />
          </div>
        ))}
      </div>
    </div>
  );
}

const STATUS = {
  awaiting_payment: ['Awaiting payment', 'honey'],
  active: ['Active', 'brine'],
  completed: ['Completed', 'copper'],
  withdrawn: ['Withdrawn', 'beet'],
} as const;

/**
 * The learner's courses as shelves of jars, one jar per lesson, from GET /api/pantry. The page hands
 * in the shelves it read on the server, so the first paint already has them and nothing below moves.
 */
export function PantryShelves({ initial }: { initial?: { shelves: Shelf[] } }) {
  const { data, error, isLoading, mutate } = useSWR<{ shelves: Shelf[] }, FetchError>('/api/pantry', (url: string) => fetchJson(url), {
    revalidateOnFocus: true,
    fallbackData: initial,
  });

  if (isLoading && !data) return <ShelfPlaceholder />;
  if (error) {
    return (
      <Card>
        <p role="alert" className="mb-3 text-beet-700">
          {error.message}
        </p>
        <Button variant="secondary" onClick={() => void mutate()}>
          Try again
        </Button>
      </Card>
    );
  }
  const shelves = data?.shelves ?? [];
  if (!shelves.length) {
    return (
      <Card>
        <p className="mb-4 text-ink-soft">Your shelf is empty. Pick a course to start filling it.</p>
        <ButtonLink href="/courses">Browse courses</ButtonLink>
      </Card>
    );
  }
  return (
    <div className="space-y-8">
      {shelves.map((shelf) => (
        <section
          key={shelf.courseSlug}
          aria-labelledby={`shelf-${shelf.courseSlug}`}
          className="rounded-jar border border-brine-100 bg-white p-5 shadow-shelf"
          data-testid={`shelf-${shelf.courseSlug}`}
        >
          <div className="mb-4 flex flex-wrap items-start justify-between gap-3">
            <div>
              <h2 id={`shelf-${shelf.courseSlug}`} className="text-xl font-bold">
                <Link href={`/courses/${shelf.courseSlug}`}>{shelf.title}</Link>
              </h2>
              <p className="text-sm text-ink-soft">
                {shelf.filled} of {shelf.jars.length} jars full
                {shelf.finalExam ? ` · final exam ${shelf.finalExam.passed ? 'passed' : 'not passed yet'}` : ''}
              </p>
            </div>
            <Badge tone={STATUS[shelf.status][1]}>{STATUS[shelf.status][0]}</Badge>
          </div>
          <ul className="flex flex-wrap items-start gap-x-4 gap-y-6 border-b-8 border-copper-700/70 pb-1" aria-label={`Lessons of ${shelf.title}`}>
            {shelf.jars.map((jar) => (
              <li key={jar.lessonSlug} className="flex w-24 flex-col items-center text-center" data-lesson={jar.lessonSlug} data-fill={jar.fill}>
                <Link href={`/learn/${shelf.courseSlug}/${jar.lessonSlug}`} className="rounded-lg focus-visible:outline-2 focus-visible:outline-copper-500">
                  <Jar fill={jar.fill} label={jar.label} />
                </Link>
                <span className="mt-1 text-xs leading-tight text-ink-soft" aria-hidden="true">
                  {jar.order}. {jar.title}
                </span>
              </li>
            ))}
          </ul>
          {shelf.next ? (
            <p className="mt-4 flex flex-wrap items-center gap-3">
              <span className="font-semibold">Next step:</span>
              <ButtonLink href={shelf.next.href} size="sm">
                {shelf.next.label}
              </ButtonLink>
            </p>
          ) : null}
        </section>
      ))}
      <p className="text-sm text-ink-soft">A jar is half full when its lesson is read or its quiz passed, and full when both are done.</p>
    </div>
  );
}

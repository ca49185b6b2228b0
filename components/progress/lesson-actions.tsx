'use client';

import Link from 'next/link';
import { useSession } from 'next-auth/react';
import { useState } from 'react';
import useSWR from 'swr';
import { Button, ButtonLink } from '@/components/ui/button';
import { errorMessage, fetchJson, postJson, type FetchError } from '@/lib/fetcher';

type Progress = { courseSlug: string; read: Record<string, string>; passedQuizzes: string[] };

/**
 * The end of every lesson page: "Mark as read" (POST /api/progress, idempotent), the read state,
 * and the way to the lesson's quiz.
 */
export function LessonActions({ courseSlug, lessonSlug, quizSlug }: { courseSlug: string; lessonSlug: string; quizSlug?: string | null }) {
  // Progress is asked for once the session is known to be there: a visitor asks nothing (the answer
  // could only be a 401, an error in every visitor's console on the public lessons).
  const session = useSession();
  const key = session.status === 'authenticated' ? `/api/progress?course=${encodeURIComponent(courseSlug)}` : null;
  const {
    data,
    error,
    isLoading: progressLoading,
    mutate,
  } = useSWR<Progress, FetchError>(key, (url: string) => fetchJson<Progress>(url), {
    shouldRetryOnError: false,
    revalidateOnFocus: false,
  });
  const [pending, setPending] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);

  const isLoading = session.status === 'loading' || progressLoading;
  const readAt = data?.read[lessonSlug];
  const quizPassed = quizSlug ? (data?.passedQuizzes ?? []).includes(quizSlug) : false;
  const signedOut = session.status === 'unauthenticated' || error?.status === 401;
  const notLearner = error?.status === 403;

  async function markRead() {
    setPending(true);
    setFailure(null);
    try {
      const result = await postJson<{ readAt: string }>('/api/progress', { courseSlug, lessonSlug });
      await mutate((current) => (current ? { ...current, read: { ...current.read, [lessonSlug]: result.readAt } } : current), { revalidate: true });
    } catch (e) {
      setFailure(errorMessage(e, 'That did not work. Please try again.'));
    } finally {
      setPending(false);
    }
  }

  return (
    <section aria-labelledby="lesson-actions-heading" className="mt-10 rounded-jar border border-brine-100 bg-paper-deep/60 p-5" data-testid="lesson-actions">
      <h2 id="lesson-actions-heading" className="mb-3 text-lg font-bold">
        Done with this lesson?
      </h2>
      <div className="flex flex-wrap items-center gap-3">
        {isLoading ? (
          <p className="text-sm text-ink-soft" role="status">
            Checking your progress…
          </p>
        ) : signedOut ? (
          <p className="text-sm text-ink-soft">
            <Link href={`/signin?callbackUrl=${encodeURIComponent(`/learn/${courseSlug}/${lessonSlug}`)}`}>Sign in</Link> to keep track of the lessons you read.
          </p>
        ) : notLearner ? (
          <p className="text-sm text-ink-soft">Reading progress is kept for learner accounts.</p>
        ) : readAt ? (
          <p className="flex items-center gap-2 font-semibold text-brine-800" role="status" data-testid="lesson-read-state">
            <svg aria-hidden="true" viewBox="0 0 20 20" className="h-5 w-5">
              <circle cx="10" cy="10" r="9" className="fill-brine-600" />
              <path d="M6 10.5l2.5 2.5L14 7.5" fill="none" stroke="white" strokeWidth="2" strokeLinecap="round" strokeLinejoin="round" />
            </svg>
            Read on {new Date(readAt).toLocaleDateString(undefined, { year: 'numeric', month: 'short', day: 'numeric' })}
          </p>
        ) : (
          <Button variant="secondary" onClick={markRead} pending={pending}>
            Mark as read
          </Button>
        )}
        {quizSlug ? (
          <ButtonLink href={`/quiz/${quizSlug}`} variant={readAt ? 'primary' : 'ghost'}>
            {quizPassed ? 'Quiz passed: take it again' : 'Take the lesson quiz'}
          </ButtonLink>
        ) : null}
      </div>
      {failure ? (
        <p className="mt-3 text-sm text-beet-700" role="alert">
          {failure}
        </p>
      ) : null}
      {error && !signedOut && !notLearner ? (
        <p className="mt-3 text-sm text-beet-700" role="alert">
          {error.message}
        </p>
      ) : null}
    </section>
  );
}

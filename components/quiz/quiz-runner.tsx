'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import { useForm } from 'react-hook-form';
import { postJson, type FetchError } from '@/lib/fetcher';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { SubmitButton } from '@/components/ui/submit-button';
import { SubmitSchema } from '@/lib/validations/quiz';
import { Countdown } from './countdown';
import { QuestionField } from './question-field';
import { QuizResult } from './quiz-result';
import { forgetAttempt, loadAnswers, openAttemptId, rememberOpenAttempt, saveAnswers } from './storage';
import { answeredCount, emptyValues, toAnswers, type AttemptView, type FormValues } from './types';

type Intro = {
  quizSlug: string;
  title: string;
  description?: string | null;
  questionCount: number;
  timeLimitMinutes: number | null;
  attemptLimit: { max: number; windowHours: number } | null;
};

type Phase = { kind: 'intro' } | { kind: 'starting' } | { kind: 'taking'; attempt: AttemptView } | { kind: 'done'; attempt: AttemptView };

/** Starts (or resumes) an attempt, keeps the answers in the browser, submits, and shows the result. */
export function QuizRunner({ intro }: { intro: Intro }) {
  const [phase, setPhase] = useState<Phase>({ kind: 'intro' });
  const [problem, setProblem] = useState<string | null>(null);
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const form = useForm<FormValues>({ defaultValues: { q: {} } });
  const submitting = useRef(false);

  const start = useCallback(async () => {
    setProblem(null);
    setPhase({ kind: 'starting' });
    try {
      const { attempt } = await postJson<{ attempt: AttemptView }>(`/api/quizzes/${intro.quizSlug}/attempts`);
      rememberOpenAttempt(intro.quizSlug, attempt.id);
      form.reset(loadAnswers(attempt.id) ?? emptyValues(attempt.questions));
      setPhase({ kind: 'taking', attempt });
    } catch (e) {
      const err = e as FetchError;
      const next = typeof err.body?.nextAttemptAt === 'string' ? new Date(err.body.nextAttemptAt as string) : null;
      setProblem(next ? `${err.message.split(' You may')[0]} You may try again on ${next.toLocaleString()}.` : err.message);
      setPhase({ kind: 'intro' });
    }
  }, [form, intro.quizSlug]);

  // A reload with an attempt still open picks it up again, with the answers saved in the browser.
  useEffect(() => {
    if (openAttemptId(intro.quizSlug) !== null) void start();
  }, [intro.quizSlug, start]);

  const attemptId = phase.kind === 'taking' ? phase.attempt.id : null;
  useEffect(() => {
    if (attemptId === null) return;
    const sub = form.watch((values) => saveAnswers(attemptId, values as FormValues));
    return () => sub.unsubscribe();
  }, [attemptId, form]);

  const submit = useCallback(
    async (values: FormValues, { ignoreErrors = false } = {}) => {
      if (phase.kind !== 'taking' || submitting.current) return;
      const attempt = phase.attempt;
      const { answers, errors } = toAnswers(attempt.questions, values);
      if (Object.keys(errors).length && !ignoreErrors) {
        setFieldErrors(errors);
        setProblem('Some answers need a look before you submit.');
        return;
      }
      const body = SubmitSchema.safeParse({ answers });
      if (!body.success) {
        setProblem('Some answers could not be read. Please check them.');
        return;
      }
      submitting.current = true;
      setProblem(null);
      setFieldErrors({});
      try {
        const result = await postJson<{ attempt: AttemptView }>(`/api/attempts/${attempt.id}/submit`, body.data);
        forgetAttempt(intro.quizSlug, attempt.id);
        setPhase({ kind: 'done', attempt: result.attempt });
      } catch (e) {
        const err = e as FetchError;
        if (err.status === 409 && err.body?.attempt) {
          forgetAttempt(intro.quizSlug, attempt.id);
          setPhase({ kind: 'done', attempt: err.body.attempt as AttemptView });
        } else if (err.status === 400 && Object.keys(err.fields).length) {
          const fields = err.fields;
          setFieldErrors(Object.fromEntries(Object.entries(fields).map(([k, v]) => [k.replace(/^answers\./, ''), v[0]])));
          setProblem(err.message);
        } else {
          setProblem(`${err.message} Your answers are kept in this browser; try again.`);
        }
      } finally {
        submitting.current = false;
      }
    },
    [intro.quizSlug, phase],
  );

  const values = form.watch();

  if (phase.kind === 'done') {
    return <QuizResult attempt={phase.attempt} retryHref={`/quiz/${intro.quizSlug}`} />;
  }

  if (phase.kind === 'intro' || phase.kind === 'starting') {
    return (
      <Card>
        {intro.description ? <p className="mb-3">{intro.description}</p> : null}
        <ul className="mb-4 list-disc space-y-1 pl-5 text-ink-soft">
          <li>{intro.questionCount} questions, marked as soon as you hand them in.</li>
          <li>{intro.timeLimitMinutes ? `You have ${intro.timeLimitMinutes} minutes once you start.` : 'No time limit.'}</li>
          {intro.attemptLimit ? <li>{`Up to ${intro.attemptLimit.max} attempts in any ${intro.attemptLimit.windowHours} hours.`}</li> : null}
          <li>Your answers are kept in this browser until you hand them in, if the page reloads.</li>
        </ul>
        {problem ? (
          <p className="mb-3 text-beet-700" role="alert">
            {problem}
          </p>
        ) : null}
        <Button onClick={start} pending={phase.kind === 'starting'}>
          {phase.kind === 'starting' ? 'Preparing your questions…' : 'Start the quiz'}
        </Button>
      </Card>
    );
  }

  const { attempt } = phase;
  const answered = answeredCount(attempt.questions, values);
  return (
    <form onSubmit={form.handleSubmit((v) => submit(v))} noValidate className="space-y-5" aria-label={attempt.title}>
      <div className="sticky top-0 z-10 flex flex-wrap items-center justify-between gap-3 rounded-lg bg-paper-deep/95 px-4 py-2">
        <p aria-live="polite">
          {answered} of {attempt.questions.length} answered
        </p>
        {attempt.deadlineAt ? <Countdown deadlineAt={attempt.deadlineAt} onExpire={() => void submit(form.getValues(), { ignoreErrors: true })} /> : null}
      </div>
      {attempt.questions.map((q, i) => (
        <QuestionField key={q.id} question={q} index={i} register={form.register} error={fieldErrors[q.id]} />
      ))}
      {problem ? (
        <p className="text-beet-700" role="alert">
          {problem}
        </p>
      ) : null}
      <div className="flex flex-wrap items-center gap-3">
        <SubmitButton pending={form.formState.isSubmitting}>Hand in my answers</SubmitButton>
        {answered < attempt.questions.length ? <p className="text-sm text-ink-soft">Unanswered questions count as wrong.</p> : null}
      </div>
    </form>
  );
}

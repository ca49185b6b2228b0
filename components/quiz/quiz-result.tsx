import { ButtonLink } from '@/components/ui/button';
import { Badge } from '@/components/ui/badge';
import { cn } from '@/lib/cn';
import { unitLabel, type AttemptView, type PublicQuestion } from './types';

type ResultQuestion = NonNullable<AttemptView['result']>['questions'][number];

function describe(q: PublicQuestion, value: ResultQuestion['given'] | ResultQuestion['right'] | null): string {
  if (value === null || value === undefined) return 'No answer';
  if (q.kind === 'single' || q.kind === 'multiple') {
    const tokens = Array.isArray(value) ? value : ((value as { choices?: string[] }).choices ?? []);
    const texts = tokens.map((t) => q.choices.find((c) => c.id === t)?.text ?? t);
    return texts.length ? texts.join('; ') : 'No answer';
  }
  if (q.kind === 'true-false') {
    const v = typeof value === 'boolean' ? value : (value as { value?: boolean }).value;
    return v ? 'True' : 'False';
  }
  const v = value as { value?: number; unit?: string; tolerance?: { abs?: number; pct?: number } };
  const tol = v.tolerance ? (v.tolerance.pct ? ` (within ${v.tolerance.pct} %)` : v.tolerance.abs ? ` (within ±${v.tolerance.abs})` : '') : '';
  return `${Number((v.value ?? 0).toFixed(2))} ${unitLabel(v.unit ?? '')}${tol}`;
}

/** The graded attempt: score, pass or not, and per question the answer given, the right one and why. */
export function QuizResult({ attempt, retryHref }: { attempt: AttemptView; retryHref?: string }) {
  const result = attempt.result;
  if (!result) return null;
  const byId = new Map(attempt.questions.map((q) => [q.id, q]));
  return (
    <section aria-labelledby="quiz-result-heading" className="space-y-6" data-testid="quiz-result">
      <div className={cn('rounded-jar border-l-8 bg-white p-5 shadow-shelf', result.passed ? 'border-brine-600' : 'border-beet-600')} role="status">
        <h2 id="quiz-result-heading" className="text-2xl font-bold">
          {result.passed ? 'Passed' : 'Not passed yet'}: {result.scorePct} %
        </h2>
        <p className="mt-1 text-ink-soft">
          {result.correct} of {result.total} right. The pass mark is {attempt.passMarkPct} %.
          {result.late ? ' The answers arrived after the time limit, so they were not counted.' : ''}
        </p>
        <div className="mt-4 flex flex-wrap gap-3">
          {attempt.lessonSlug ? (
            <ButtonLink href={`/learn/${attempt.courseSlug}/${attempt.lessonSlug}`} variant="secondary">
              Back to the lesson
            </ButtonLink>
          ) : null}
          <ButtonLink href="/pantry" variant={result.passed ? 'primary' : 'secondary'}>
            Go to your Pantry
          </ButtonLink>
          {!result.passed && retryHref ? (
            <ButtonLink href={retryHref} variant="primary">
              Try again
            </ButtonLink>
          ) : null}
        </div>
      </div>
      <ol className="space-y-4">
        {result.questions.map((r, i) => {
          const q = byId.get(r.id);
          if (!q) return null;
          return (
            <li key={r.id} className="rounded-jar border border-brine-100 bg-white p-4" data-result={r.correct ? 'right' : 'wrong'}>
              <div className="flex items-start justify-between gap-3">
                <h3 className="font-semibold">
                  <span className="mr-2 text-ink-soft">{i + 1}.</span>
                  {q.prompt}
                </h3>
                <Badge tone={r.correct ? 'brine' : 'beet'}>{r.correct ? 'Right' : r.answered ? 'Wrong' : 'Not answered'}</Badge>
              </div>
              <dl className="mt-2 grid gap-1 text-sm sm:grid-cols-[10rem_1fr]">
                <dt className="font-semibold text-ink-soft">Your answer</dt>
                <dd>{describe(q, r.given)}</dd>
                {!r.correct ? (
                  <>
                    <dt className="font-semibold text-ink-soft">Right answer</dt>
                    <dd>{describe(q, r.right)}</dd>
                  </>
                ) : null}
              </dl>
              <p className="mt-2 text-sm">{r.explanation}</p>
            </li>
          );
        })}
      </ol>
    </section>
  );
}

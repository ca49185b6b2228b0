import type { Metadata } from 'next';
import { QuestionResultsTable } from '@/components/quiz/question-results-table';
import { Button, ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { fieldClasses } from '@/components/ui/text-field';
import { requirePageRole } from '@/lib/auth/guard';
import { fieldErrors } from '@/lib/errors';
import { fetchWorkshopOptions } from '@/lib/practicals/data';
import { getBanks } from '@/lib/quiz/bank';
import { fetchQuestionResults, ResultsFilterSchema, type ResultsFilter } from '@/lib/quiz/results';

export const metadata: Metadata = { title: 'Question results' };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

const first = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v) || undefined;

export default async function QuestionResultsPage({ searchParams }: Props) {
  await requirePageRole('/tasting-table/questions', 'instructor');
  const raw = await searchParams;
  const input = { workshop: first(raw.workshop), from: first(raw.from), to: first(raw.to), quiz: first(raw.quiz) };
  const parsed = ResultsFilterSchema.safeParse(input);
  const filter: ResultsFilter = parsed.success ? parsed.data : {};
  const errors = parsed.success ? {} : fieldErrors(parsed.error);
  const [stats, workshops] = await Promise.all([fetchQuestionResults(filter), fetchWorkshopOptions()]);
  const quizzes = getBanks().map((b) => ({ slug: b.slug, title: b.title }));
  const answered = stats.reduce((n, s) => n + s.attempts, 0);

  return (
    <div className="space-y-6">
      <header className="space-y-1">
        <h1 className="text-3xl font-bold">Question results</h1>
        <p className="text-ink-soft">How learners answer each question of each quiz, to see what the class finds hard. The lowest % right comes first.</p>
      </header>
      <Card>
        <form method="get" className="flex flex-wrap items-end gap-4" aria-label="Filter the question results">
          <div>
            <label htmlFor="f-quiz" className="block text-sm font-semibold">
              Quiz
            </label>
            <select id="f-quiz" name="quiz" defaultValue={filter.quiz ?? ''} className={`${fieldClasses} border-ink-faint/40`}>
              <option value="">All quizzes</option>
              {quizzes.map((q) => (
                <option key={q.slug} value={q.slug}>
                  {q.title}
                </option>
              ))}
            </select>
          </div>
          <div>
            <label htmlFor="f-workshop" className="block text-sm font-semibold">
              Workshop
            </label>
            <select
              id="f-workshop"
              name="workshop"
              defaultValue={filter.workshop ? String(filter.workshop) : ''}
              className={`${fieldClasses} border-ink-faint/40`}
            >
              <option value="">All workshops</option>
              {workshops.map((w) => (
                <option key={w.id} value={w.id}>
                  {w.label}
                </option>
              ))}
            </select>
          </div>
          <div>
            <label htmlFor="f-from" className="block text-sm font-semibold">
              From
            </label>
            <input
              id="f-from"
              type="date"
              name="from"
              defaultValue={filter.from ?? ''}
              className={`${fieldClasses} border-ink-faint/40`}
              aria-describedby={errors.from ? 'f-from-error' : undefined}
            />
            {errors.from ? (
              <p id="f-from-error" className="text-sm text-beet-600">
                {errors.from[0]}
              </p>
            ) : null}
          </div>
          <div>
            <label htmlFor="f-to" className="block text-sm font-semibold">
              To
            </label>
            <input
              id="f-to"
              type="date"
              name="to"
              defaultValue={filter.to ?? ''}
              className={`${fieldClasses} border-ink-faint/40`}
              aria-describedby={errors.to ? 'f-to-error' : undefined}
            />
            {errors.to ? (
              <p id="f-to-error" className="text-sm text-beet-600">
                {errors.to[0]}
              </p>
            ) : null}
          </div>
          <Button type="submit" variant="secondary">
            Show
          </Button>
          <ButtonLink href="/tasting-table/questions" variant="ghost">
            Clear
          </ButtonLink>
        </form>
        {!parsed.success ? (
          <p role="alert" className="mt-3 text-sm text-beet-700">
            Some filters could not be read and were ignored: {Object.keys(errors).join(', ')}.
          </p>
        ) : null}
      </Card>
      <p className="text-sm text-ink-soft" role="status">
        {answered} graded answers to {stats.length} questions.
      </p>
      <QuestionResultsTable stats={stats} />
    </div>
  );
}

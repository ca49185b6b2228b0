'use client';

import { useMemo, useState } from 'react';
import { EmptyRow, Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';
import type { QuestionStat } from '@/lib/quiz/results';

type Key = 'quizTitle' | 'prompt' | 'attempts' | 'rightPct' | 'topWrongCount';
const COLUMNS: { key: Key; label: string; numeric?: boolean }[] = [
  { key: 'quizTitle', label: 'Quiz' },
  { key: 'prompt', label: 'Question' },
  { key: 'attempts', label: 'Answers', numeric: true },
  { key: 'rightPct', label: '% right', numeric: true },
  { key: 'topWrongCount', label: 'Most chosen wrong answer', numeric: true },
];

/** The question results, sortable by any column (click a header; click again to reverse). */
export function QuestionResultsTable({ stats }: { stats: QuestionStat[] }) {
  const [sort, setSort] = useState<{ key: Key; dir: 'asc' | 'desc' }>({ key: 'rightPct', dir: 'asc' });
  const rows = useMemo(() => {
    const sign = sort.dir === 'asc' ? 1 : -1;
    return [...stats].sort((a, b) => {
      const x = a[sort.key];
      const y = b[sort.key];
      const c = typeof x === 'number' && typeof y === 'number' ? x - y : String(x).localeCompare(String(y));
      return c * sign || a.quizSlug.localeCompare(b.quizSlug) || a.questionId.localeCompare(b.questionId);
    });
  }, [stats, sort]);

  const toggle = (key: Key) => setSort((s) => (s.key === key ? { key, dir: s.dir === 'asc' ? 'desc' : 'asc' } : { key, dir: 'asc' }));

  return (
    <Table caption="How each question was answered" data-testid="question-results">
      <THead>
        <tr>
          {COLUMNS.map((c) => (
            <TH key={c.key} aria-sort={sort.key === c.key ? (sort.dir === 'asc' ? 'ascending' : 'descending') : 'none'}>
              <button type="button" onClick={() => toggle(c.key)} className="inline-flex items-center gap-1 font-semibold hover:underline">
                {c.label}
                <span aria-hidden="true">{sort.key === c.key ? (sort.dir === 'asc' ? '▲' : '▼') : '↕'}</span>
              </button>
            </TH>
          ))}
        </tr>
      </THead>
      <TBody>
        {rows.length === 0 ? (
          <EmptyRow colSpan={COLUMNS.length}>No graded answers match these filters yet.</EmptyRow>
        ) : (
          rows.map((r) => (
            <TR key={`${r.quizSlug}/${r.questionId}`} data-question={r.questionId}>
              <TD className="whitespace-nowrap">{r.quizTitle}</TD>
              <TD className="max-w-md">{r.prompt}</TD>
              <TD className="text-right tabular-nums">{r.attempts}</TD>
              <TD>
                <div className="flex items-center gap-2">
                  <span className="w-12 text-right tabular-nums">{r.rightPct} %</span>
                  <span className="h-2.5 w-24 overflow-hidden rounded-full bg-beet-100" aria-hidden="true">
                    <span className="block h-full bg-brine-600" style={{ width: `${r.rightPct}%` }} />
                  </span>
                </div>
              </TD>
              <TD>
                {r.topWrong ? (
                  <span>
                    {r.topWrong}{' '}
                    <span className="text-ink-soft">
                      ({r.topWrongCount} of {r.attempts})
                    </span>
                  </span>
                ) : (
                  <span className="text-ink-soft">None</span>
                )}
              </TD>
            </TR>
          ))
        )}
      </TBody>
    </Table>
  );
}

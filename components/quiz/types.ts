import type { AttemptResult, AttemptView } from '@/lib/quiz/attempts';
import type { Answers, PublicQuestion } from '@/lib/quiz/grading';

export type { AttemptResult, AttemptView, Answers, PublicQuestion };

/** What the form holds for one question; turned into an API answer on submit. */
export type FormAnswer = { choice?: string; choices?: string[]; tf?: '' | 'true' | 'false'; value?: string; unit?: string };
export type FormValues = { q: Record<string, FormAnswer> };

const NUMBER = /^-?\d+(?:[.,]\d+)?$/;

/** Form values → the body's answers; blank questions are left out (they count as unanswered). */
export function toAnswers(questions: PublicQuestion[], values: FormValues): { answers: Answers; errors: Record<string, string> } {
  const answers: Answers = {};
  const errors: Record<string, string> = {};
  for (const q of questions) {
    const v = values.q?.[q.id] ?? {};
    if (q.kind === 'single' && v.choice) answers[q.id] = v.choice;
    else if (q.kind === 'multiple' && v.choices && v.choices.length) answers[q.id] = v.choices;
    else if (q.kind === 'true-false' && (v.tf === 'true' || v.tf === 'false')) answers[q.id] = v.tf === 'true';
    else if (q.kind === 'numeric' && v.value && v.value.trim()) {
      const raw = v.value.trim();
      if (!NUMBER.test(raw)) errors[q.id] = 'Enter a number, such as 15 or 2.5.';
      else answers[q.id] = { value: Number(raw.replace(',', '.')), unit: v.unit || q.units[0] };
    }
  }
  return { answers, errors };
}

export function emptyValues(questions: PublicQuestion[]): FormValues {
  return {
    q: Object.fromEntries(
      questions.map((q) => [
        q.id,
        q.kind === 'multiple'
          ? { choices: [] }
          : q.kind === 'numeric'
            ? { value: '', unit: q.units[0] }
            : q.kind === 'true-false'
              ? { tf: '' }
              : { choice: '' },
      ]),
    ),
  };
}

/** How many questions have an answer in the form. */
export function answeredCount(questions: PublicQuestion[], values: FormValues): number {
  return Object.keys(toAnswers(questions, values).answers).length;
}

export const UNIT_LABELS: Record<string, string> = { min: 'minutes', psi: 'pounds (psi)', F: '°F', C: '°C', in: 'inches', '%': 'percent', 'fl-oz': 'fl oz' };
export const unitLabel = (u: string) => UNIT_LABELS[u] ?? u;

import { AppError } from '@/lib/errors';
import type { NumericUnit, ResolvedQuestion } from './schema';

// Drawing, the learner's view and grading of one attempt. Pure: no database, no randomness that
// cannot be injected, so every rule here is unit-tested.

/** What an attempt stores about its questions: the order drawn and, per choice question, the choice order shown. */
export type DrawnQuestion = { id: string; choices?: string[] };
export type Drawn = { questions: DrawnQuestion[] };

/** The learner's view of a question: no answer, no tolerance, no explanation. Choices carry tokens, not the bank's ids. */
export type PublicQuestion =
  | { id: string; kind: 'single' | 'multiple'; prompt: string; choices: { id: string; text: string }[] }
  | { id: string; kind: 'true-false'; prompt: string }
  | { id: string; kind: 'numeric'; prompt: string; units: NumericUnit[] };

export type Answer = string | string[] | boolean | { value: number; unit: string };
export type Answers = Record<string, Answer>;

export type Random = () => number;

function shuffle<T>(items: readonly T[], random: Random): T[] {
  const out = [...items];
  for (let i = out.length - 1; i > 0; i -= 1) {
    const j = Math.floor(random() * (i + 1));
    [out[i], out[j]] = [out[j], out[i]];
  }
  return out;
}

/** Draws `count` questions at random, in a random order, with the choices of each shuffled. */
export function drawQuestions(questions: readonly ResolvedQuestion[], count: number, random: Random = Math.random): Drawn {
  const picked = shuffle(questions, random).slice(0, Math.min(count, questions.length));
  return {
    questions: picked.map((q) =>
      q.kind === 'single' || q.kind === 'multiple'
        ? {
            id: q.id,
            choices: shuffle(
              q.choices.map((c) => c.id),
              random,
            ),
          }
        : { id: q.id },
    ),
  };
}

/** The token a shown choice carries: its position, so the bank's ids (and their authoring order) never leave the server. */
const token = (index: number) => `c${index + 1}`;

function byId(questions: readonly ResolvedQuestion[]): Map<string, ResolvedQuestion> {
  return new Map(questions.map((q) => [q.id, q]));
}

/** The questions of an attempt as the learner sees them, in the drawn order. */
export function publicQuestions(questions: readonly ResolvedQuestion[], drawn: Drawn): PublicQuestion[] {
  const bank = byId(questions);
  return drawn.questions.flatMap((d): PublicQuestion[] => {
    const q = bank.get(d.id);
    if (!q) return [];
    if (q.kind === 'single' || q.kind === 'multiple') {
      const texts = new Map(q.choices.map((c) => [c.id, c.text]));
      return [{ id: q.id, kind: q.kind, prompt: q.prompt, choices: (d.choices ?? []).map((cid, i) => ({ id: token(i), text: texts.get(cid) ?? '' })) }];
    }
    if (q.kind === 'true-false') return [{ id: q.id, kind: 'true-false', prompt: q.prompt }];
    return [{ id: q.id, kind: 'numeric', prompt: q.prompt, units: q.units }];
  });
}

export type Converter = (value: number, from: string, to: string) => number;

export type QuestionResult = {
  id: string;
  correct: boolean;
  answered: boolean;
  /** The answer in the bank's terms: choice ids, true/false, or "value unit". Used by the question results. */
  response: string | null;
  /** For numeric answers given in another unit: the value in the unit the question asks for. */
  valueInUnit?: number;
};

export type Grade = { correct: number; total: number; scorePct: number; passed: boolean; results: QuestionResult[] };

/** Checks that every answer belongs to a drawn question and fits its kind; a 400 naming each wrong field otherwise. */
export function checkAnswers(questions: readonly ResolvedQuestion[], drawn: Drawn, answers: Answers): void {
  const bank = byId(questions);
  const shown = new Map(drawn.questions.map((d) => [d.id, d]));
  const fields: Record<string, string[]> = {};
  const wrong = (key: string, message: string) => (fields[`answers.${key}`] ??= []).push(message);
  for (const [qid, answer] of Object.entries(answers)) {
    const d = shown.get(qid);
    const q = bank.get(qid);
    if (!d || !q) {
      wrong(qid, 'This question is not part of this attempt.');
      continue;
    }
    const tokens = new Set((d.choices ?? []).map((_, i) => token(i)));
    if (q.kind === 'single') {
      if (typeof answer !== 'string' || !tokens.has(answer)) wrong(qid, 'Choose one of the choices shown.');
    } else if (q.kind === 'multiple') {
      if (!Array.isArray(answer) || answer.some((a) => !tokens.has(a)) || new Set(answer).size !== answer.length)
        wrong(qid, 'Choose among the choices shown, each once.');
    } else if (q.kind === 'true-false') {
      if (typeof answer !== 'boolean') wrong(qid, 'Answer true or false.');
    } else if (typeof answer !== 'object' || Array.isArray(answer) || answer === null) {
      wrong(qid, 'Give a number and a unit.');
    } else if (!q.units.includes(answer.unit as NumericUnit)) {
      wrong(qid, `Give the answer in ${q.units.join(' or ')}.`);
    }
  }
  if (Object.keys(fields).length) {
    throw new AppError('bad_request', 'Some answers do not fit this attempt.', { fields });
  }
}

/** True when `value` is within the question's tolerance of `expected` (edges included). */
export function withinTolerance(value: number, expected: number, tolerance: { abs?: number; pct?: number }): boolean {
  const diff = Math.abs(value - expected);
  const eps = 1e-9 * Math.max(1, Math.abs(expected));
  const abs = tolerance.abs ?? 0;
  const pct = tolerance.pct !== undefined ? (tolerance.pct / 100) * Math.abs(expected) : 0;
  return diff <= Math.max(abs, pct) + eps;
}

const sameSet = (a: readonly string[], b: readonly string[]) => a.length === b.length && a.every((x) => b.includes(x));

/** Grades an attempt. Unanswered questions count as wrong. `checkAnswers` must have passed first. */
export function gradeAttempt(questions: readonly ResolvedQuestion[], drawn: Drawn, answers: Answers, passMarkPct: number, convert: Converter): Grade {
  const bank = byId(questions);
  const results: QuestionResult[] = [];
  for (const d of drawn.questions) {
    const q = bank.get(d.id);
    if (!q) continue;
    const answer = answers[d.id];
    if (answer === undefined) {
      results.push({ id: d.id, correct: false, answered: false, response: null });
      continue;
    }
    const fromToken = (t: string) => (d.choices ?? [])[Number(t.slice(1)) - 1];
    if (q.kind === 'single') {
      const chosen = fromToken(answer as string);
      results.push({ id: q.id, correct: chosen === q.answer, answered: true, response: chosen });
    } else if (q.kind === 'multiple') {
      const chosen = (answer as string[]).map(fromToken).sort();
      results.push({ id: q.id, correct: sameSet(chosen, q.answer), answered: true, response: chosen.join(',') });
    } else if (q.kind === 'true-false') {
      results.push({ id: q.id, correct: answer === q.answer, answered: true, response: String(answer) });
    } else {
      const { value, unit } = answer as { value: number; unit: string };
      const target = q.units[0];
      const inUnit = unit === target ? value : convert(value, unit, target);
      results.push({
        id: q.id,
        correct: withinTolerance(inUnit, q.answer, q.tolerance),
        answered: true,
        response: `${value} ${unit}`,
        ...(unit === target ? {} : { valueInUnit: inUnit }),
      });
    }
  }
  const correct = results.filter((r) => r.correct).length;
  const total = results.length;
  const scorePct = total ? Math.round((correct / total) * 10000) / 100 : 0;
  return { correct, total, scorePct, passed: scorePct >= passMarkPct, results };
}

/** The right answer of a question, for the learner once the attempt is submitted, in the shown tokens. */
export function rightAnswer(
  q: ResolvedQuestion,
  d: DrawnQuestion,
): { choices?: string[]; value?: boolean | number; unit?: string; tolerance?: { abs?: number; pct?: number } } {
  if (q.kind === 'single' || q.kind === 'multiple') {
    const right = q.kind === 'single' ? [q.answer] : q.answer;
    return { choices: (d.choices ?? []).map((cid, i) => (right.includes(cid) ? token(i) : null)).filter((t): t is string => t !== null) };
  }
  if (q.kind === 'true-false') return { value: q.answer };
  return { value: q.answer, unit: q.units[0], tolerance: q.tolerance };
}

/** Maps the bank's choice ids of a stored response back to the tokens shown in this attempt. */
export function responseTokens(d: DrawnQuestion, response: string | null): string[] {
  if (!response) return [];
  const ids = response.split(',');
  return (d.choices ?? []).map((cid, i) => (ids.includes(cid) ? token(i) : null)).filter((t): t is string => t !== null);
}

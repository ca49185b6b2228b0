import { describe, expect, it } from 'vitest';
import { createRequire } from 'node:module';
import { convertUnits } from './compute';
import { checkAnswers, drawQuestions, gradeAttempt, publicQuestions, rightAnswer, withinTolerance, type Drawn } from './grading';
import type { ResolvedQuestion } from './schema';

// convert-units ships no type declarations; a small local type is enough here.
const convertUnitsLib = createRequire(import.meta.url)('convert-units') as (v: number) => { from: (u: string) => { to: (u: string) => number } };

const questions: ResolvedQuestion[] = [
  {
    id: 'one',
    kind: 'single',
    prompt: 'Pick b',
    explanation: 'x',
    choices: [
      { id: 'a', text: 'A' },
      { id: 'b', text: 'B' },
      { id: 'c', text: 'C' },
    ],
    answer: 'b',
  },
  {
    id: 'many',
    kind: 'multiple',
    prompt: 'Pick a and c',
    explanation: 'x',
    choices: [
      { id: 'a', text: 'A' },
      { id: 'b', text: 'B' },
      { id: 'c', text: 'C' },
    ],
    answer: ['a', 'c'],
  },
  { id: 'tf', kind: 'true-false', prompt: 'False', explanation: 'x', answer: false },
  { id: 'num', kind: 'numeric', prompt: '15 min', explanation: 'x', units: ['min'], answer: 15, tolerance: { abs: 0 } },
  { id: 'grams', kind: 'numeric', prompt: '52.63 g ±2 %', explanation: 'x', units: ['g', 'oz'], answer: 52.63, tolerance: { pct: 2 } },
  { id: 'temp', kind: 'numeric', prompt: '202.8 F ±0.6', explanation: 'x', units: ['F', 'C'], answer: 202.83, tolerance: { abs: 0.6 } },
];
// A fixed draw (no shuffling) so the tokens are known: choice token cN is the N-th choice shown.
const drawn: Drawn = {
  questions: [{ id: 'one', choices: ['c', 'b', 'a'] }, { id: 'many', choices: ['a', 'b', 'c'] }, { id: 'tf' }, { id: 'num' }, { id: 'grams' }, { id: 'temp' }],
};
const grade = (answers: Parameters<typeof gradeAttempt>[2]) => gradeAttempt(questions, drawn, answers, 80, convertUnits);
const result = (answers: Parameters<typeof gradeAttempt>[2], id: string) => grade(answers).results.find((r) => r.id === id)!;

describe('grading, each kind', () => {
  it('single choice: right only for the token shown for the answer', () => {
    expect(result({ one: 'c2' }, 'one')).toMatchObject({ correct: true, response: 'b' });
    expect(result({ one: 'c1' }, 'one')).toMatchObject({ correct: false, response: 'c' });
  });

  it('select-all: every right choice and no wrong one, order irrelevant', () => {
    expect(result({ many: ['c3', 'c1'] }, 'many')).toMatchObject({ correct: true, response: 'a,c' });
    expect(result({ many: ['c1'] }, 'many').correct).toBe(false);
    expect(result({ many: ['c1', 'c2', 'c3'] }, 'many').correct).toBe(false);
  });

  it('true/false', () => {
    expect(result({ tf: false }, 'tf').correct).toBe(true);
    expect(result({ tf: true }, 'tf').correct).toBe(false);
  });

  it('numeric with zero tolerance: exact only', () => {
    expect(result({ num: { value: 15, unit: 'min' } }, 'num').correct).toBe(true);
    expect(result({ num: { value: 15.01, unit: 'min' } }, 'num').correct).toBe(false);
    expect(result({ num: { value: 20, unit: 'min' } }, 'num').correct).toBe(false);
  });

  it('unanswered counts as wrong, and the score and pass mark follow', () => {
    const g = grade({ one: 'c2', many: ['c1', 'c3'], tf: false, num: { value: 15, unit: 'min' }, grams: { value: 52.63, unit: 'g' } });
    expect(g).toMatchObject({ correct: 5, total: 6, scorePct: 83.33, passed: true });
    expect(g.results.find((r) => r.id === 'temp')).toMatchObject({ answered: false, correct: false, response: null });
    const four = grade({ one: 'c2', many: ['c1', 'c3'], tf: false, num: { value: 15, unit: 'min' } });
    expect(four).toMatchObject({ correct: 4, scorePct: 66.67, passed: false });
  });

  it('passes exactly at the pass mark', () => {
    const five: ResolvedQuestion[] = questions.slice(0, 5);
    const d: Drawn = { questions: drawn.questions.slice(0, 5) };
    const g = gradeAttempt(five, d, { one: 'c2', many: ['c1', 'c3'], tf: false, num: { value: 15, unit: 'min' } }, 80, convertUnits);
    expect(g).toMatchObject({ correct: 4, total: 5, scorePct: 80, passed: true });
  });
});

describe('tolerance edges', () => {
  it('absolute tolerance includes both edges and nothing beyond', () => {
    expect(withinTolerance(202.83 + 0.6, 202.83, { abs: 0.6 })).toBe(true);
    expect(withinTolerance(202.83 - 0.6, 202.83, { abs: 0.6 })).toBe(true);
    expect(withinTolerance(202.83 + 0.61, 202.83, { abs: 0.6 })).toBe(false);
    expect(withinTolerance(202.83 - 0.601, 202.83, { abs: 0.6 })).toBe(false);
  });

  it('percentage tolerance is relative to the expected value', () => {
    expect(withinTolerance(102, 100, { pct: 2 })).toBe(true);
    expect(withinTolerance(98, 100, { pct: 2 })).toBe(true);
    expect(withinTolerance(102.01, 100, { pct: 2 })).toBe(false);
    expect(withinTolerance(97.99, 100, { pct: 2 })).toBe(false);
  });

  it('the wider of abs and pct applies when both are given', () => {
    expect(withinTolerance(11, 10, { abs: 1, pct: 5 })).toBe(true);
    expect(withinTolerance(11.01, 10, { abs: 1, pct: 5 })).toBe(false);
  });
});

describe('units', () => {
  it('grams question answered in ounces: converted before comparing', () => {
    // 1 oz = 28.349523125 g exactly (NIST Handbook 44, Appendix C); cross-checked with convert-units.
    const ozFor52_63 = 52.63 / 28.349523125;
    expect(convertUnitsLib(52.63).from('g').to('oz')).toBeCloseTo(ozFor52_63, 5); // convert-units rounds the pound to 453.592 g
    expect(result({ grams: { value: ozFor52_63, unit: 'oz' } }, 'grams')).toMatchObject({ correct: true, response: `${ozFor52_63} oz` });
    expect(result({ grams: { value: 1.87, unit: 'oz' } }, 'grams').correct).toBe(true); // 53.01 g, within 2 % (±1.05 g)
    expect(result({ grams: { value: 1.8, unit: 'oz' } }, 'grams').correct).toBe(false); // 51.03 g, below 51.58 g
  });

  it('a number in the wrong unit is wrong even if the digits match', () => {
    expect(result({ grams: { value: 52.63, unit: 'oz' } }, 'grams').correct).toBe(false);
  });

  it('°F question answered in °C: 95 °C is 203 °F, inside ±0.6 of 202.83; 94.5 °C (202.1 °F) is not', () => {
    expect(result({ temp: { value: 95, unit: 'C' } }, 'temp')).toMatchObject({ correct: true, valueInUnit: 203 });
    expect(result({ temp: { value: 94.5, unit: 'C' } }, 'temp').correct).toBe(false);
  });
});

describe('checkAnswers', () => {
  it('refuses an answer to a question that was not drawn, naming it', () => {
    const partial: Drawn = { questions: [{ id: 'tf' }] };
    expect(() => checkAnswers(questions, partial, { tf: true, num: { value: 1, unit: 'min' } })).toThrowError(
      expect.objectContaining({ type: 'bad_request', fields: { 'answers.num': [expect.any(String)] } }),
    );
  });

  it('refuses answers that do not fit their kind', () => {
    try {
      checkAnswers(questions, drawn, { one: 'c9', many: ['c1', 'c1'], tf: 'yes', num: true, grams: { value: 1, unit: 'min' } } as never);
      expect.unreachable();
    } catch (e) {
      expect(Object.keys((e as { fields: object }).fields).sort()).toEqual(['answers.grams', 'answers.many', 'answers.num', 'answers.one', 'answers.tf']);
    }
  });

  it('accepts a partial, well-formed set of answers', () => {
    expect(() => checkAnswers(questions, drawn, { tf: true })).not.toThrow();
  });
});

describe('drawing and the public view', () => {
  it('draws the requested number, each once, and shuffles choices', () => {
    let seed = 7;
    const random = () => ((seed = (seed * 16807) % 2147483647) - 1) / 2147483646;
    const d = drawQuestions(questions, 4, random);
    expect(d.questions).toHaveLength(4);
    expect(new Set(d.questions.map((q) => q.id)).size).toBe(4);
    for (const q of d.questions) if (q.choices) expect([...q.choices].sort()).toEqual(['a', 'b', 'c']);
  });

  it('the public view carries no answer, tolerance, explanation or bank choice id', () => {
    const view = publicQuestions(questions, drawn);
    const text = JSON.stringify(view);
    for (const key of ['answer', 'tolerance', 'explanation', 'computedFrom']) expect(text).not.toContain(`"${key}"`);
    expect(view[0]).toEqual({
      id: 'one',
      kind: 'single',
      prompt: 'Pick b',
      choices: [
        { id: 'c1', text: 'C' },
        { id: 'c2', text: 'B' },
        { id: 'c3', text: 'A' },
      ],
    });
  });

  it('rightAnswer maps the key back to the shown tokens', () => {
    expect(rightAnswer(questions[0], drawn.questions[0])).toEqual({ choices: ['c2'] });
    expect(rightAnswer(questions[1], drawn.questions[1])).toEqual({ choices: ['c1', 'c3'] });
  });
});

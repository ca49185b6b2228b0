import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadLessons } from '@/lib/content/loader';
import { processingTime, saltForBrine } from '@/lib/preserving';
import { loadBanks } from './bank';
import { COMPUTE_FNS } from './compute';
import { BankError, parseBankFile, resolveBanks } from './resolve';

const banks = loadBanks();
// The flagship's lessons as the content lists them, so a new lesson needs its quiz here too.
const LESSONS = loadLessons(path.join(process.cwd(), 'content'), 'pickling-and-canning').map((l) => l.slug);

describe('the question banks in content/quizzes', () => {
  it('one quiz of at least 6 questions per flagship lesson', () => {
    expect(LESSONS.length).toBeGreaterThanOrEqual(9);
    for (const lesson of LESSONS) {
      const bank = banks.get(`pickling-and-canning--${lesson}`);
      expect(bank, lesson).toBeDefined();
      expect(bank!.questions.length, lesson).toBeGreaterThanOrEqual(6);
      expect(bank!.lesson).toBe(lesson);
    }
  });

  it('a final exam of 25 drawn from at least 40, 3 attempts in 24 hours, and the refresher quiz', () => {
    const exam = banks.get('pickling-and-canning--final-exam')!;
    expect(exam.draw).toBe(25);
    expect(exam.questions.length).toBeGreaterThanOrEqual(40);
    expect(exam.attemptLimit).toEqual({ max: 3, windowHours: 24 });
    const refresher = banks.get('volunteer-refresher--quiz')!;
    expect(refresher.course).toBe('volunteer-refresher');
    expect(refresher.questions.length).toBeGreaterThanOrEqual(6);
  });

  it('every question has an explanation, and every computed one names its source in it', () => {
    for (const bank of banks.values()) {
      for (const q of bank.questions) {
        expect(q.explanation.length, q.id).toBeGreaterThan(20);
        expect(q.explanation, q.id).not.toContain('{answer}');
      }
    }
  });

  it('numeric answers come from lib/preserving, so a table change moves the quiz with it', () => {
    const proc = banks.get('pickling-and-canning--processing')!.questions.find((q) => q.id === 'proc-dill-pint-3000')!;
    // USDA-CG Guide 6 (rev. 2015), quick fresh-pack dill pickles: pints 15 min at 1,001-6,000 ft.
    expect(proc.answer).toBe(15);
    expect(proc.answer).toBe(processingTime({ product: 'fresh-pack-dill-pickles', jar: 'pint', altitudeFt: 3000 }).minutes);
    const salt = banks.get('pickling-and-canning--salt-sugar-and-water')!.questions.find((q) => q.id === 'salt-brine-grams')!;
    expect(salt.answer).toBe(saltForBrine({ salt: 'canning', waterMl: 1000, brinePct: 5 }).grams);
  });
});

describe('bank validation', () => {
  const minimal = { slug: 'pickling-and-canning--x', course: 'pickling-and-canning', title: 'X' };

  it('names the file and the field of a broken question', () => {
    expect(() =>
      parseBankFile(
        {
          ...minimal,
          questions: [
            {
              id: 'q',
              kind: 'single',
              prompt: 'P',
              explanation: 'E',
              choices: [
                { id: 'a', text: 'A' },
                { id: 'b', text: 'B' },
              ],
              answer: 'z',
            },
          ],
        },
        'x.json',
      ),
    ).toThrow(/x\.json: questions\.0\.answer: the answer must be one of the choices/);
    expect(() =>
      parseBankFile({ ...minimal, questions: [{ id: 'q', kind: 'numeric', prompt: 'P', explanation: 'E', units: ['furlong'], answer: 1 }] }, 'x.json'),
    ).toThrow(/^x\.json: questions\.0/);
  });

  it('refuses a draw larger than the bank, a duplicate id, an unknown include and a failing compute', () => {
    const q = { id: 'q', kind: 'true-false', prompt: 'P', explanation: 'E', answer: true };
    expect(() => resolveBanks([parseBankFile({ ...minimal, draw: 2, questions: [q] }, 'x')], COMPUTE_FNS)).toThrow(BankError);
    expect(() => resolveBanks([parseBankFile({ ...minimal, questions: [q, q] }, 'x')], COMPUTE_FNS)).toThrow(/appears twice/);
    expect(() => resolveBanks([parseBankFile({ ...minimal, include: ['pickling-and-canning--nope'], questions: [q] }, 'x')], COMPUTE_FNS)).toThrow(
      /unknown quiz/,
    );
    const bad = {
      id: 'n',
      kind: 'numeric',
      prompt: 'P',
      explanation: 'E',
      units: ['min'],
      answer: { compute: 'processingTime', args: { product: 'no-such', jar: 'pint', altitudeFt: 0 }, field: 'minutes' },
    };
    expect(() => resolveBanks([parseBankFile({ ...minimal, questions: [bad] }, 'x')], COMPUTE_FNS)).toThrow(/processingTime failed/);
  });
});

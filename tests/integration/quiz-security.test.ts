import { beforeAll, describe, expect, it } from 'vitest';
import { POST as start } from '@/app/api/quizzes/[quiz]/attempts/route';
import { getCourses, getLessons } from '@/lib/content';
import { getBanks } from '@/lib/quiz/bank';
import { formatAnswer } from '@/lib/quiz/resolve';
import { createCourses, createUser, resetDatabase } from '../support/db';
import { params } from '../support/request';
import { actAs } from '../support/session';
import { enroll } from '../support/quiz-support';

// The answer key never reaches a learner before submission: for every bank, start an attempt and
// look through the raw JSON for each key field and for each question's right-answer markers.
const KEY_FIELDS = ['"answer"', '"explanation"', '"tolerance"', '"computedFrom"', '"compute"', '"right"', '"correct"', '"result"', '"decimals"'];

describe('no answer key before submission', () => {
  beforeAll(async () => {
    await resetDatabase();
    const { flagship, refresher } = await createCourses();
    const learner = await createUser('learner');
    await enroll(learner.id, flagship.id);
    await enroll(learner.id, refresher.id);
    actAs(learner);
  });

  it("covers every lesson quiz of every course, the fermenting lesson's among them", () => {
    const slugs = getBanks().map((b) => b.slug);
    for (const course of getCourses()) for (const lesson of getLessons(course.slug)) expect(slugs).toContain(lesson.quiz);
    expect(slugs).toContain('pickling-and-canning--fermented-pickles-and-sauerkraut');
  });

  for (const bank of getBanks()) {
    it(bank.slug, async () => {
      const response = await start(new Request(`http://localhost/api/quizzes/${bank.slug}/attempts`, { method: 'POST' }), params({ quiz: bank.slug }));
      expect(response.status).toBe(201);
      const raw = await response.text();
      for (const key of KEY_FIELDS) expect(raw, key).not.toContain(key);
      const attempt = JSON.parse(raw).attempt;
      const byId = new Map(bank.questions.map((q) => [q.id, q]));
      for (const shown of attempt.questions) {
        const q = byId.get(shown.id)!;
        expect(q, shown.id).toBeDefined();
        // The explanation (which states the right answer) is a marker that must not appear.
        expect(raw).not.toContain(q.explanation.slice(0, 60));
        if (q.kind === 'single' || q.kind === 'multiple') {
          // Choices carry position tokens only; the bank's choice ids (a, b, …) do not leave the server.
          expect(shown.choices.map((c: { id: string }) => c.id)).toEqual(q.choices.map((_, i) => `c${i + 1}`));
          expect(Object.keys(shown.choices[0]).sort()).toEqual(['id', 'text']);
        }
        if (q.kind === 'numeric') {
          expect(Object.keys(shown).sort()).toEqual(['id', 'kind', 'prompt', 'units']);
          // The computed value is not hidden anywhere in the answer (beyond digits in a prompt).
          const marker = formatAnswer(q.answer, 4);
          if (!q.prompt.includes(marker)) expect(JSON.stringify(shown)).not.toContain(marker);
        }
        if (q.kind === 'true-false') expect(Object.keys(shown).sort()).toEqual(['id', 'kind', 'prompt']);
      }
    });
  }
});

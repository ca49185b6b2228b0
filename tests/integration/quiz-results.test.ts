import { beforeEach, describe, expect, it, vi } from 'vitest';
import { POST as submit } from '@/app/api/attempts/[id]/submit/route';
import { POST as start } from '@/app/api/quizzes/[quiz]/attempts/route';
import { getBank } from '@/lib/quiz/bank';
import { fetchQuestionResults, ResultsFilterSchema } from '@/lib/quiz/results';
import { db } from '@/models';
import { createCourses, createUser, resetDatabase } from '../support/db';
import { jsonRequest, params } from '../support/request';
import { actAs } from '../support/session';
import { answersFor, drawnOf, enroll } from '../support/quiz-support';

const QUIZ = 'pickling-and-canning--why-preserving-is-a-safety-job';

async function takeQuiz(
  user: Awaited<ReturnType<typeof createUser>>,
  tweak: (answers: Record<string, unknown>, tokenFor: (qid: string, choiceId: string) => string) => void = () => {},
) {
  actAs(user);
  const { attempt } = await (await start(new Request('http://localhost/x', { method: 'POST' }), params({ quiz: QUIZ }))).json();
  const answers = (await answersFor(attempt.id)) as Record<string, unknown>;
  const { drawn } = await drawnOf(attempt.id);
  const tokenFor = (qid: string, choiceId: string) => `c${drawn.questions.find((d) => d.id === qid)!.choices!.indexOf(choiceId) + 1}`;
  tweak(answers, tokenFor);
  const response = await submit(jsonRequest('/x', { answers }), params({ id: String(attempt.id) }));
  expect(response.status).toBe(200);
  return attempt.id as number;
}

let workshopA: number;
let workshopB: number;

beforeEach(async () => {
  await resetDatabase();
  const { flagship } = await createCourses();
  const mk = (d: string) =>
    db().Workshop.create({
      courseId: flagship.id,
      startsAt: new Date(d),
      endsAt: new Date(d),
      timeZone: 'America/Denver',
      place: 'Cedar Hollow Grange Hall',
      seats: 12,
    });
  workshopA = (await mk('2026-12-10T16:00:00Z')).id;
  workshopB = (await mk('2027-01-10T16:00:00Z')).id;
  // Workshop A: three learners. Two answer the pH question wrongly with "pH 5.6", one with "pH 7.0".
  for (const [i, wrong] of ['b', 'b', 'c'].entries()) {
    const u = await createUser('learner');
    await enroll(u.id, flagship.id, 'active', workshopA);
    await takeQuiz(u, (answers, tokenFor) => {
      answers['safety-ph-line'] = tokenFor('safety-ph-line', wrong);
      if (i === 0) delete answers['safety-bw-temp'];
    });
  }
  // Workshop B: one learner, all right.
  const b = await createUser('learner');
  await enroll(b.id, flagship.id, 'active', workshopB);
  await takeQuiz(b);
});

describe('question results (one aggregated query)', () => {
  it('counts answers, % right, unanswered and the most chosen wrong answer per question, in one query', async () => {
    const spy = vi.spyOn(db().sequelize, 'query');
    const stats = await fetchQuestionResults({});
    expect(spy).toHaveBeenCalledTimes(1);
    spy.mockRestore();
    const bank = getBank(QUIZ)!;
    expect(stats).toHaveLength(bank.questions.length);
    const ph = stats.find((s) => s.questionId === 'safety-ph-line')!;
    expect(ph).toMatchObject({ attempts: 4, right: 1, rightPct: 25, topWrong: 'pH 5.6', topWrongCount: 2, quizTitle: bank.title });
    const temp = stats.find((s) => s.questionId === 'safety-bw-temp')!;
    expect(temp).toMatchObject({ attempts: 4, right: 3, rightPct: 75, unanswered: 1, topWrong: null, topWrongCount: 0 });
    const smell = stats.find((s) => s.questionId === 'safety-smell-test')!;
    expect(smell).toMatchObject({ attempts: 4, right: 4, rightPct: 100, topWrong: null });
  });

  it('filters by workshop and by date range (inclusive days, UTC)', async () => {
    const a = await fetchQuestionResults({ workshop: workshopA });
    expect(a.find((s) => s.questionId === 'safety-ph-line')).toMatchObject({ attempts: 3, right: 0, rightPct: 0 });
    const b = await fetchQuestionResults({ workshop: workshopB });
    expect(b.find((s) => s.questionId === 'safety-ph-line')).toMatchObject({ attempts: 1, right: 1, topWrong: null });
    const today = new Date().toISOString().slice(0, 10);
    expect((await fetchQuestionResults({ from: today, to: today })).find((s) => s.questionId === 'safety-ph-line')!.attempts).toBe(4);
    expect(await fetchQuestionResults({ from: '2020-01-01', to: '2020-01-31' })).toEqual([]);
    expect(await fetchQuestionResults({ quiz: 'pickling-and-canning--acidity' })).toEqual([]);
  });

  it('the filter schema refuses a reversed range and bad dates', () => {
    expect(ResultsFilterSchema.safeParse({ from: '2026-12-05', to: '2026-12-01' }).success).toBe(false);
    expect(ResultsFilterSchema.safeParse({ from: '12/01/2026' }).success).toBe(false);
    expect(ResultsFilterSchema.safeParse({ workshop: '3', from: '2026-12-01' }).data).toEqual({ workshop: 3, from: '2026-12-01' });
  });
});

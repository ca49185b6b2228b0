import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { POST as submit } from '@/app/api/attempts/[id]/submit/route';
import { POST as start } from '@/app/api/quizzes/[quiz]/attempts/route';
import { db } from '@/models';
import { jsonRequest, params } from '../support/request';
import { actAs } from '../support/session';
import { answersFor, freshLearner } from '../support/quiz-support';

// The database round trips one graded submission costs (the hot path of `npm run bench:grading`),
// counted with Sequelize's query hook: a regression guard for the request path, not a timing test.

const QUIZ = 'pickling-and-canning--acidity';
// Each statement with the order in which it was sent and in which its answer came back.
let statements: { sql: string; sent: number; done: number }[] = [];
// (sent/done order kept for diagnosing overlaps when a test fails)
let clock = 0;
const open = new Map<unknown, { sql: string; sent: number; done: number }>();
const sent = (_options: unknown, query: object) => {
  const entry = { sql: '', sent: ++clock, done: 0 };
  open.set(query, entry);
  statements.push(entry);
};
const done = (_options: unknown, query: { sql?: string }) => {
  const entry = open.get(query);
  if (entry)
    Object.assign(entry, {
      sql: String(query.sql ?? '')
        .split(/\s+/)
        .slice(0, 2)
        .join(' '),
      done: ++clock,
    });
};
const names = () => statements.map((s) => s.sql);

beforeEach(() => {
  db().sequelize.addHook('beforeQuery', 'round-trips-sent', sent as never);
  db().sequelize.addHook('afterQuery', 'round-trips-done', done as never);
});
afterEach(() => {
  db().sequelize.removeHook('beforeQuery', 'round-trips-sent');
  db().sequelize.removeHook('afterQuery', 'round-trips-done');
});

describe('round trips of POST /api/attempts/[id]/submit', () => {
  it('grades in at most 3 round trips whatever the number of questions; a repeat submit reads the stored result in at most 2', async () => {
    const { learner } = await freshLearner();
    actAs(learner);
    const started = await (await start(new Request(`http://localhost/api/quizzes/${QUIZ}/attempts`, { method: 'POST' }), params({ quiz: QUIZ }))).json();
    const answers = await answersFor(started.attempt.id);

    statements = [];
    const first = await submit(jsonRequest(`/api/attempts/${started.attempt.id}/submit`, { answers }), params({ id: String(started.attempt.id) }));
    expect(first.status).toBe(200);
    const graded = await first.json();
    expect(graded.graded).toBe(true);
    expect(graded.attempt.result.passed).toBe(true);
    // What matters is the bound, not the SQL text: the grading figure assumes at most three round trips.
    expect(statements.length, names().join(' | ')).toBeLessThanOrEqual(3);
    expect(statements.length).toBeLessThan(graded.attempt.result.total);
    // Every answer row was written, one per question.
    expect(await db().QuizAnswer.count({ where: { attemptId: started.attempt.id } })).toBe(graded.attempt.result.total);

    statements = [];
    const again = await submit(jsonRequest(`/api/attempts/${started.attempt.id}/submit`, { answers }), params({ id: String(started.attempt.id) }));
    const repeated = await again.json();
    expect(repeated.graded).toBe(false);
    expect(repeated.attempt.result).toEqual(graded.attempt.result);
    expect(statements.length, names().join(' | ')).toBeLessThanOrEqual(2);
    expect(await db().QuizAnswer.count()).toBe(graded.attempt.result.total);
  });
});

describe('the write of a grade is all or nothing, and happens once', () => {
  it("rolls back the attempt's result when an answer row cannot be written, leaving the attempt open", async () => {
    const { learner } = await freshLearner();
    actAs(learner);
    const started = await (await start(new Request(`http://localhost/api/quizzes/${QUIZ}/attempts`, { method: 'POST' }), params({ quiz: QUIZ }))).json();
    const id = started.attempt.id as number;
    const firstQuestion = started.attempt.questions[0].id as string;
    // A stray row with the same (attemptId, questionId) makes the INSERT hit the unique key.
    const open = (await db().QuizAttempt.findByPk(id))!;
    await db().QuizAnswer.create({
      attemptId: id,
      courseId: open.courseId,
      workshopId: null,
      quizSlug: open.quizSlug,
      questionId: firstQuestion,
      correct: false,
      response: null,
      submittedAt: new Date(),
    });
    const failed = await submit(jsonRequest(`/api/attempts/${id}/submit`, { answers: await answersFor(id) }), params({ id: String(id) }));
    expect(failed.status).toBe(500);
    const attempt = await db().QuizAttempt.findByPk(id, { attributes: ['submittedAt', 'scorePct', 'answers'], raw: true });
    expect(attempt).toEqual({ submittedAt: null, scorePct: null, answers: null });
    expect(await db().QuizAnswer.count({ where: { attemptId: id } })).toBe(1);
    // The connection went back to the pool outside any transaction: the next statement commits on its own.
    await db().QuizAnswer.destroy({ where: { attemptId: id } });
    const retried = await submit(jsonRequest(`/api/attempts/${id}/submit`, { answers: await answersFor(id) }), params({ id: String(id) }));
    expect(retried.status).toBe(200);
    expect((await retried.json()).graded).toBe(true);
  });

  it('five submissions at once: one grades, the others return the same stored result, one set of answer rows', async () => {
    const { learner } = await freshLearner();
    actAs(learner);
    const started = await (await start(new Request(`http://localhost/api/quizzes/${QUIZ}/attempts`, { method: 'POST' }), params({ quiz: QUIZ }))).json();
    const id = started.attempt.id as number;
    const right = await answersFor(id);
    const wrong = await answersFor(id, { wrong: 2 });
    const responses = await Promise.all(
      [right, wrong, right, wrong, right].map((answers) => submit(jsonRequest(`/api/attempts/${id}/submit`, { answers }), params({ id: String(id) }))),
    );
    const bodies = await Promise.all(responses.map((r) => r.json()));
    expect(responses.map((r) => r.status)).toEqual([200, 200, 200, 200, 200]);
    expect(bodies.filter((b) => b.graded)).toHaveLength(1);
    for (const b of bodies) expect(b.attempt.result).toEqual(bodies.find((x) => x.graded).attempt.result);
    expect(await db().QuizAnswer.count({ where: { attemptId: id } })).toBe(bodies[0].attempt.result.total);
  });
});

import { beforeEach, describe, expect, it } from 'vitest';
import { GET as getAttempt } from '@/app/api/attempts/[id]/route';
import { POST as submit } from '@/app/api/attempts/[id]/submit/route';
import { POST as start } from '@/app/api/quizzes/[quiz]/attempts/route';
import { getBank } from '@/lib/quiz/bank';
import { db } from '@/models';
import { createCourses, createUser } from '../support/db';
import { jsonRequest, params } from '../support/request';
import { actAs } from '../support/session';
import { answersFor, drawnOf, enroll, freshLearner } from '../support/quiz-support';

const LESSON_QUIZ = 'pickling-and-canning--acidity';
const EXAM = 'pickling-and-canning--final-exam';

const startReq = (quiz: string) => start(new Request(`http://localhost/api/quizzes/${quiz}/attempts`, { method: 'POST' }), params({ quiz }));
const submitReq = (id: number | string, body: unknown) => submit(jsonRequest(`/api/attempts/${id}/submit`, body), params({ id: String(id) }));
const getReq = (id: number | string) => getAttempt(new Request(`http://localhost/api/attempts/${id}`), params({ id: String(id) }));

let courses: Awaited<ReturnType<typeof createCourses>>;
let learner: Awaited<ReturnType<typeof createUser>>;

beforeEach(async () => {
  ({ courses, learner } = await freshLearner());
});

async function startAs(user: typeof learner, quiz = LESSON_QUIZ) {
  actAs(user);
  const response = await startReq(quiz);
  return { response, body: await response.json() };
}

describe('POST /api/quizzes/[quiz]/attempts', () => {
  it('signed out is 401; an instructor is 403; a learner not enrolled is 403, as are awaiting-payment and withdrawn enrollments', async () => {
    expect((await startReq(LESSON_QUIZ)).status).toBe(401);
    actAs(await createUser('instructor'));
    expect((await startReq(LESSON_QUIZ)).status).toBe(403);
    const stranger = await createUser('learner');
    expect((await startAs(stranger)).response.status).toBe(403);
    await enroll(stranger.id, courses.flagship.id, 'awaiting_payment');
    expect((await startAs(stranger)).response.status).toBe(403);
    // Enrolled in the flagship, not in the refresher:
    expect((await startAs(learner, 'volunteer-refresher--quiz')).response.status).toBe(403);
    expect(await db().QuizAttempt.count()).toBe(0);
  });

  it('an unknown quiz is 404 and a malformed name is 400', async () => {
    expect((await startAs(learner, 'pickling-and-canning--no-such-quiz')).response.status).toBe(404);
    const bad = await startAs(learner, 'Not A Slug');
    expect(bad.response.status).toBe(400);
    expect(bad.body.fields.quiz).toBeDefined();
  });

  it('draws and stores the order; the answer is the questions without any key; a completed enrollment may start too', async () => {
    const { response, body } = await startAs(learner);
    expect(response.status).toBe(201);
    const bank = getBank(LESSON_QUIZ)!;
    expect(body.attempt.questions).toHaveLength(bank.questions.length);
    const { drawn } = await drawnOf(body.attempt.id);
    expect(drawn.questions.map((q) => q.id)).toEqual(body.attempt.questions.map((q: { id: string }) => q.id));
    const text = JSON.stringify(body);
    for (const key of ['"answer"', '"explanation"', '"tolerance"', '"computedFrom"', '"result"', '"right"']) expect(text).not.toContain(key);
    for (const q of bank.questions) expect(text).not.toContain(q.explanation);

    const graduate = await createUser('learner');
    await enroll(graduate.id, courses.flagship.id, 'completed');
    expect((await startAs(graduate)).response.status).toBe(201);
  });

  it('returns the open attempt instead of starting a second one (a reload does not burn an attempt)', async () => {
    const first = await startAs(learner, EXAM);
    const again = await startAs(learner, EXAM);
    expect(first.response.status).toBe(201);
    expect(again.response.status).toBe(200);
    expect(again.body.attempt.id).toBe(first.body.attempt.id);
    expect(first.body.attempt.questions).toHaveLength(25);
    expect(first.body.attempt.deadlineAt).not.toBeNull();
  });

  it('allows 3 final-exam attempts in 24 hours, then 429 with the time of the next allowed attempt', async () => {
    const started: string[] = [];
    for (let i = 0; i < 3; i += 1) {
      const { response, body } = await startAs(learner, EXAM);
      expect(response.status).toBe(201);
      started.push(body.attempt.startedAt);
      expect((await submitReq(body.attempt.id, { answers: {} })).status).toBe(200);
    }
    const fourth = await startAs(learner, EXAM);
    expect(fourth.response.status).toBe(429);
    const expected = new Date(new Date(started[0]).getTime() + 24 * 3_600_000);
    expect(Math.abs(new Date(fourth.body.nextAttemptAt).getTime() - expected.getTime())).toBeLessThan(1000);
    expect(fourth.body.message).toMatch(/3 attempts/);
    // Lesson quizzes have no limit by default.
    for (let i = 0; i < 4; i += 1) {
      const { response, body } = await startAs(learner, LESSON_QUIZ);
      expect(response.status).toBe(201);
      await submitReq(body.attempt.id, { answers: {} });
    }
    // Once the oldest attempt is more than 24 h old, a new one is allowed.
    await db().sequelize.query('UPDATE quiz_attempts SET startedAt = DATE_SUB(startedAt, INTERVAL 25 HOUR) WHERE quizSlug = :q ORDER BY id LIMIT 1', {
      replacements: { q: EXAM },
    });
    expect((await startAs(learner, EXAM)).response.status).toBe(201);
  });
});

describe('POST /api/attempts/[id]/submit', () => {
  it('grades on the server: all right passes, and every answer is stored with a quiz_answers row each', async () => {
    const { body } = await startAs(learner);
    const response = await submitReq(body.attempt.id, { answers: await answersFor(body.attempt.id) });
    expect(response.status).toBe(200);
    const result = await response.json();
    expect(result.graded).toBe(true);
    expect(result.attempt.result).toMatchObject({ scorePct: 100, passed: true, correct: 7, total: 7 });
    const row = await db().QuizAttempt.findByPk(body.attempt.id);
    expect(row!.passed).toBe(true);
    expect(Number(row!.scorePct)).toBe(100);
    expect(row!.submittedAt).not.toBeNull();
    const n = await db().QuizAnswer.count({ where: { attemptId: body.attempt.id, correct: true } });
    expect(Number(n)).toBe(7);
  });

  it('uses the course pass mark: 2 wrong of 7 (71.43 %) fails at 80 %, 1 wrong (85.71 %) passes', async () => {
    let { body } = await startAs(learner);
    let graded = await (await submitReq(body.attempt.id, { answers: await answersFor(body.attempt.id, { wrong: 2 }) })).json();
    expect(graded.attempt.result).toMatchObject({ scorePct: 71.43, passed: false, correct: 5 });
    ({ body } = await startAs(learner));
    graded = await (await submitReq(body.attempt.id, { answers: await answersFor(body.attempt.id, { wrong: 1 }) })).json();
    expect(graded.attempt.result).toMatchObject({ scorePct: 85.71, passed: true });
    expect(graded.attempt.passMarkPct).toBe(80);
  });

  it('submitting twice at once grades once and returns the same result', async () => {
    const { body } = await startAs(learner);
    const good = await answersFor(body.attempt.id);
    const bad = await answersFor(body.attempt.id, { wrong: 7 });
    const [a, b] = await Promise.all([submitReq(body.attempt.id, { answers: good }), submitReq(body.attempt.id, { answers: bad })]);
    expect([a.status, b.status]).toEqual([200, 200]);
    const [ra, rb] = [await a.json(), await b.json()];
    expect([ra.graded, rb.graded].sort()).toEqual([false, true]);
    expect(ra.attempt.result).toEqual(rb.attempt.result);
    const n = await db().QuizAnswer.count({ where: { attemptId: body.attempt.id } });
    expect(Number(n)).toBe(7);
    // A later third submit still returns the stored result.
    const third = await (await submitReq(body.attempt.id, { answers: good })).json();
    expect(third).toMatchObject({ graded: false, attempt: { result: ra.attempt.result } });
  });

  it('refuses answers to questions not drawn (400, naming them) and leaves the attempt open', async () => {
    const { body } = await startAs(learner);
    const response = await submitReq(body.attempt.id, { answers: { 'proc-dill-pint-3000': { value: 15, unit: 'min' } } });
    expect(response.status).toBe(400);
    expect((await response.json()).fields['answers.proc-dill-pint-3000']).toBeDefined();
    expect((await db().QuizAttempt.findByPk(body.attempt.id))!.submittedAt).toBeNull();
  });

  it('answers bodies that are not valid with 400 and the fields, never 500', async () => {
    const { body } = await startAs(learner);
    for (const bad of [{}, { answers: 'x' }, { answers: { a: { value: 'ten', unit: 'min' } } }, { answers: {}, extra: 1 }, '{"answers": ']) {
      const response = await submitReq(body.attempt.id, bad);
      expect(response.status, JSON.stringify(bad)).toBe(400);
      expect((await response.json()).fields, JSON.stringify(bad)).toBeDefined();
    }
    expect((await submitReq('abc', { answers: {} })).status).toBe(400);
    expect((await submitReq(999999, { answers: {} })).status).toBe(404);
  });

  it("another learner cannot submit someone's attempt (403); signed out is 401", async () => {
    const { body } = await startAs(learner);
    actAs(null);
    expect((await submitReq(body.attempt.id, { answers: {} })).status).toBe(401);
    const other = await createUser('learner');
    await enroll(other.id, courses.flagship.id);
    actAs(other);
    expect((await submitReq(body.attempt.id, { answers: {} })).status).toBe(403);
    expect((await db().QuizAttempt.findByPk(body.attempt.id))!.submittedAt).toBeNull();
  });

  it('enforces the time limit on the server: answers after the deadline are not counted (409)', async () => {
    const { body } = await startAs(learner, EXAM);
    const answers = await answersFor(body.attempt.id);
    await db().sequelize.query('UPDATE quiz_attempts SET deadlineAt = DATE_SUB(NOW(), INTERVAL 1 MINUTE) WHERE id = ?', { replacements: [body.attempt.id] });
    const response = await submitReq(body.attempt.id, { answers });
    expect(response.status).toBe(409);
    const late = await response.json();
    expect(late.attempt.result).toMatchObject({ late: true, scorePct: 0, passed: false });
    const row = await db().QuizAttempt.findByPk(body.attempt.id);
    expect(row!.passed).toBe(false);
    // In time (deadline ahead) the same answers pass.
    const next = await startAs(learner, EXAM);
    const ok = await (await submitReq(next.body.attempt.id, { answers: await answersFor(next.body.attempt.id) })).json();
    expect(ok.attempt.result).toMatchObject({ passed: true, scorePct: 100 });
  });
});

describe('GET /api/attempts/[id]', () => {
  it('before submission: no key; after: explanations and right answers, to the owner, an instructor and a coordinator only', async () => {
    const { body } = await startAs(learner);
    const before = await (await getReq(body.attempt.id)).json();
    expect(before.attempt.result).toBeUndefined();
    expect(JSON.stringify(before)).not.toContain('"explanation"');

    await submitReq(body.attempt.id, { answers: await answersFor(body.attempt.id, { wrong: 1 }) });
    const after = await (await getReq(body.attempt.id)).json();
    expect(after.attempt.result.questions).toHaveLength(7);
    const first = after.attempt.result.questions[0];
    expect(first.correct).toBe(false);
    expect(first.explanation.length).toBeGreaterThan(20);
    expect(first.right).toBeDefined();

    const other = await createUser('learner');
    actAs(other);
    expect((await getReq(body.attempt.id)).status).toBe(403);
    actAs(null);
    expect((await getReq(body.attempt.id)).status).toBe(401);
    for (const role of ['instructor', 'coordinator'] as const) {
      actAs(await createUser(role));
      const seen = await getReq(body.attempt.id);
      expect(seen.status).toBe(200);
      expect((await seen.json()).attempt.result.scorePct).toBe(85.71);
    }
    actAs(learner);
    expect((await getReq(0)).status).toBe(400);
    expect((await getReq(424242)).status).toBe(404);
  });

  it('an attempt row without a draw or grade (seeded history) reads as 200 with no result, not 500', async () => {
    const row = await db().QuizAttempt.create({
      userId: learner.id,
      courseId: courses.flagship.id,
      quizSlug: LESSON_QUIZ,
      drawn: '[]',
      answers: {},
      scorePct: 100,
      passed: true,
      startedAt: new Date(),
      submittedAt: new Date(),
    });
    actAs(learner);
    const response = await getReq(row.id);
    expect(response.status).toBe(200);
    const body = await response.json();
    expect(body.attempt.questions).toEqual([]);
    expect(body.attempt.result).toBeUndefined();
  });
});

import { QueryTypes } from 'sequelize';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { POST as submit } from '@/app/api/attempts/[id]/submit/route';
import { POST as start } from '@/app/api/quizzes/[quiz]/attempts/route';
import { db } from '@/models';
import { jsonRequest, params } from '../helpers/request';
import { actAs } from '../helpers/session';
import { answersFor, freshLearner } from './quiz-support';

// The database round trips one graded submission costs (the hot path of `npm run bench:grading`),
// counted with Sequelize's query hook: a regression guard for the request path, not a timing test.

const QUIZ = 'pickling-and-canning--acidity';
// Each statement with the order in which it was sent and in which its answer came back.
let statements: { sql: string; sent: number; done: number }[] = [];
let clock = 0;
const open = new Map<unknown, { sql: string; sent: number; done: number }>();
const sent = (_options: unknown, query: object) => {
  const entry = { sql: '', sent: ++clock, done: 0 };
  open.set(query, entry);
  statements.push(entry);
};
const done = (_options: unknown, query: { sql?: string }) => {
  const entry = open.get(query);
  if (entry) Object.assign(entry, { sql: String(query.sql ?? '').split(/\s+/).slice(0, 2).join(' '), done: ++clock });
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
  it('grades with 5 statements and 4 waits (the two writes go together); a repeat submit reads the stored result under the lock', async () => {
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
    expect(names()).toEqual(['START TRANSACTION;', 'SELECT qa.*,', 'UPDATE quiz_attempts', 'INSERT INTO', 'COMMIT;']);
    const [, select, update, insert] = statements;
    // The locked read is answered before the writes are sent; the INSERT is sent before the UPDATE's answer is back.
    expect(select.done).toBeLessThan(update.sent);
    expect(insert.sent).toBeLessThan(update.done);
    // Every answer row was written, by the one multi-row INSERT.
    const [{ n }] = await db().sequelize.query<{ n: number | string }>('SELECT COUNT(*) AS n FROM quiz_answers WHERE attemptId = :id', { replacements: { id: started.attempt.id }, type: QueryTypes.SELECT });
    expect(Number(n)).toBe(graded.attempt.result.total);

    statements = [];
    const again = await submit(jsonRequest(`/api/attempts/${started.attempt.id}/submit`, { answers }), params({ id: String(started.attempt.id) }));
    const repeated = await again.json();
    expect(repeated.graded).toBe(false);
    expect(repeated.attempt.result).toEqual(graded.attempt.result);
    expect(names()).toEqual(['START TRANSACTION;', 'SELECT qa.*,', 'COMMIT;']);
    expect(await db().sequelize.query('SELECT COUNT(*) AS n FROM quiz_answers', { type: QueryTypes.SELECT })).toEqual([{ n: graded.attempt.result.total }]);
  });
});

import { beforeEach, describe, expect, it } from 'vitest';
import { GET as pantry } from '@/app/api/pantry/route';
import { GET as getProgress, POST as markRead } from '@/app/api/progress/route';
import { POST as submit } from '@/app/api/attempts/[id]/submit/route';
import { POST as start } from '@/app/api/quizzes/[quiz]/attempts/route';
import { getLesson, getLessons } from '@/lib/content';
import { lessonsForVersion } from '@/lib/content/versions';
import { db } from '@/models';
import { createCourses, createUser } from '../support/db';
import { jsonRequest, params } from '../support/request';
import { actAs } from '../support/session';
import { answersFor, enroll, freshLearner } from '../support/quiz-support';
import { eligibleEnrollment } from '../support/certificate-fixtures';

let courses: Awaited<ReturnType<typeof createCourses>>;
let learner: Awaited<ReturnType<typeof createUser>>;
const mark = (body: unknown) => markRead(jsonRequest('/api/progress', body), {});
const progressOf = (course: string) => getProgress(new Request(`http://localhost/api/progress?course=${course}`), {});
const shelves = async () => (await (await pantry(new Request('http://localhost/api/pantry'), {})).json()).shelves;

beforeEach(async () => {
  ({ courses, learner } = await freshLearner());
});

describe('POST /api/progress', () => {
  it('marks a lesson read once: 201, then 200 with the same time, one row', async () => {
    actAs(learner);
    const first = await mark({ courseSlug: 'pickling-and-canning', lessonSlug: 'acidity' });
    expect(first.status).toBe(201);
    const again = await mark({ courseSlug: 'pickling-and-canning', lessonSlug: 'acidity' });
    expect(again.status).toBe(200);
    expect((await again.json()).readAt).toBe((await first.json()).readAt);
    expect(await db().LessonProgress.count()).toBe(1);
    const both = await Promise.all([1, 2, 3].map(() => mark({ courseSlug: 'pickling-and-canning', lessonSlug: 'processing' })));
    expect(both.map((r) => r.status).sort()).toEqual([200, 200, 201]);
    expect(await db().LessonProgress.count()).toBe(2);
    const progress = await (await progressOf('pickling-and-canning')).json();
    expect(Object.keys(progress.read).sort()).toEqual(['acidity', 'processing']);
  });

  it('401 signed out, 403 for staff and for a learner not enrolled, 404 for an unknown lesson or course, 400 with fields', async () => {
    expect((await mark({ courseSlug: 'pickling-and-canning', lessonSlug: 'acidity' })).status).toBe(401);
    actAs(await createUser('instructor'));
    expect((await mark({ courseSlug: 'pickling-and-canning', lessonSlug: 'acidity' })).status).toBe(403);
    actAs(learner);
    expect((await mark({ courseSlug: 'volunteer-refresher', lessonSlug: 'acid-and-ph-review' })).status).toBe(403);
    expect((await mark({ courseSlug: 'pickling-and-canning', lessonSlug: 'no-such-lesson' })).status).toBe(404);
    expect((await mark({ courseSlug: 'no-such-course', lessonSlug: 'acidity' })).status).toBe(404);
    const bad = await mark({ courseSlug: 'Pickling!', lessonSlug: '' });
    expect(bad.status).toBe(400);
    expect(Object.keys((await bad.json()).fields).sort()).toEqual(['courseSlug', 'lessonSlug']);
    expect((await mark('not json')).status).toBe(400);
    expect((await progressOf('')).status).toBe(400);
    expect(await db().LessonProgress.count()).toBe(0);
  });
});

describe('GET /api/pantry', () => {
  it('nine jars for an enrollment begun under the current content, eight for one begun before the fermenting lesson', async () => {
    const NEW_LESSON = 'fermented-pickles-and-sauerkraut';
    const all = getLessons('pickling-and-canning');
    const older = all.filter((l) => l.slug !== NEW_LESSON);
    expect(all.find((l) => l.slug === NEW_LESSON)?.since).toBe(2);

    actAs(learner);
    let [shelf] = await shelves();
    expect(shelf.jars.map((j: { lessonSlug: string }) => j.lessonSlug)).toEqual(older.map((l) => l.slug));
    expect(shelf.jars).toHaveLength(8);

    const newcomer = await createUser('learner');
    await enroll(newcomer.id, courses.flagship.id).then((e) => e.update({ contentVersion: 2 }));
    actAs(newcomer);
    [shelf] = await shelves();
    expect(shelf.jars.map((j: { lessonSlug: string }) => j.lessonSlug)).toEqual(all.map((l) => l.slug));
    expect(shelf.jars).toHaveLength(9);
  });

  it('shows a shelf per course with a jar per lesson that fills as it is read and its quiz passed', async () => {
    const title = getLesson('pickling-and-canning', 'acidity')!.title;
    actAs(learner);
    let [shelf] = await shelves();
    expect(shelf.courseSlug).toBe('pickling-and-canning');
    // freshLearner's enrollment is written without a content version, so it is held to version 1's lessons.
    expect(shelf.jars).toHaveLength(lessonsForVersion(getLessons('pickling-and-canning'), 1).length);
    const acidity = () => shelf.jars.find((j: { lessonSlug: string }) => j.lessonSlug === 'acidity');
    expect(acidity()).toMatchObject({ fill: 0, label: `${title}: not read yet, quiz not passed yet` });
    expect(shelf.next.href).toBe('/learn/pickling-and-canning/why-preserving-is-a-safety-job');

    await mark({ courseSlug: 'pickling-and-canning', lessonSlug: 'acidity' });
    [shelf] = await shelves();
    expect(acidity()).toMatchObject({ fill: 0.5, read: true, quizPassed: false });

    const started = await (await start(new Request('http://localhost/x', { method: 'POST' }), params({ quiz: 'pickling-and-canning--acidity' }))).json();
    await submit(jsonRequest('/x', { answers: await answersFor(started.attempt.id) }), params({ id: String(started.attempt.id) }));
    [shelf] = await shelves();
    expect(acidity()).toMatchObject({ fill: 1, label: `${title}: read, quiz passed` });
    expect(shelf.filled).toBe(1);
    expect(shelf.finalExam).toEqual({ quizSlug: 'pickling-and-canning--final-exam', passed: false });
  });

  it("with every jar full, names what the certificate still needs (the desk's own checks) and points to the practical", async () => {
    const { userId } = await eligibleEnrollment(courses.flagship, { skip: { practical: true, attended: true } });
    actAs({ id: userId, email: 'x@test.example', name: 'Jo', roles: ['learner'] });
    const [shelf] = await shelves();
    expect(shelf.filled).toBe(shelf.jars.length);
    expect(shelf.next).toEqual({ label: 'Every jar is full. Still to do: practical batch, workshop', href: '/learn/pickling-and-canning/practical' });
  });

  it("a failed quiz does not fill the jar; another learner's progress never shows; staff get 403", async () => {
    actAs(learner);
    const started = await (await start(new Request('http://localhost/x', { method: 'POST' }), params({ quiz: 'pickling-and-canning--acidity' }))).json();
    await submit(jsonRequest('/x', { answers: await answersFor(started.attempt.id, { wrong: 3 }) }), params({ id: String(started.attempt.id) }));
    const other = await createUser('learner');
    await enroll(other.id, courses.flagship.id);
    actAs(other);
    await mark({ courseSlug: 'pickling-and-canning', lessonSlug: 'acidity' });
    actAs(learner);
    const [shelf] = await shelves();
    expect(shelf.jars.every((j: { fill: number }) => j.fill === 0)).toBe(true);
    actAs(await createUser('instructor'));
    expect((await pantry(new Request('http://localhost/api/pantry'), {})).status).toBe(403);
    actAs(null);
    expect((await pantry(new Request('http://localhost/api/pantry'), {})).status).toBe(401);
  });
});

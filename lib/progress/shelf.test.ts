import { describe, expect, it } from 'vitest';
import { buildShelf, jarLabel } from './shelf';

const lessons = [
  { slug: 'acidity', title: 'Acidity', order: 2, quiz: 'c--acidity' },
  { slug: 'why', title: 'Why', order: 1, quiz: 'c--why' },
  { slug: 'salt', title: 'Salt', order: 3, quiz: 'c--salt' },
];
const base = { slug: 'c', title: 'Course', status: 'active' as const, finalExam: 'c--final-exam', lessons, read: {}, passedQuizzes: [] as string[] };

describe('buildShelf', () => {
  it('orders jars by lesson and fills each half for reading, half for the quiz', () => {
    const shelf = buildShelf({ ...base, read: { why: '2026-12-01T00:00:00Z', acidity: '2026-12-01T00:00:00Z' }, passedQuizzes: ['c--acidity', 'c--salt'] });
    expect(shelf.jars.map((j) => [j.lessonSlug, j.fill])).toEqual([
      ['why', 0.5],
      ['acidity', 1],
      ['salt', 0.5],
    ]);
    expect(shelf.filled).toBe(1);
    expect(shelf.jars[1].label).toBe('Acidity: read, quiz passed');
    expect(shelf.jars[0].label).toBe('Why: read, quiz not passed yet');
    expect(shelf.jars[2].label).toBe('Salt: not read yet, quiz passed');
  });

  it('the next step is the earliest lesson to read or quiz to pass, then the final exam, then the course page', () => {
    expect(buildShelf(base).next).toEqual({ label: 'Read lesson 1: Why', href: '/learn/c/why' });
    expect(buildShelf({ ...base, read: { why: 'x' } }).next).toEqual({ label: 'Take the quiz for lesson 1: Why', href: '/quiz/c--why' });
    const allDone = { read: { why: 'x', acidity: 'x', salt: 'x' }, passedQuizzes: ['c--why', 'c--acidity', 'c--salt'] };
    expect(buildShelf({ ...base, ...allDone }).next).toEqual({ label: 'Take the final exam', href: '/quiz/c--final-exam' });
    const exam = buildShelf({ ...base, ...allDone, passedQuizzes: [...allDone.passedQuizzes, 'c--final-exam'] });
    expect(exam.finalExam).toEqual({ quizSlug: 'c--final-exam', passed: true });
    expect(exam.next?.href).toBe('/courses/c');
    // With every jar full, what is left is said by name; the practical's page when the batch is among it.
    const done = { ...base, ...allDone, passedQuizzes: [...allDone.passedQuizzes, 'c--final-exam'] };
    expect(buildShelf({ ...done, remaining: ['practical batch', 'workshop'] }).next).toEqual({
      label: 'Every jar is full. Still to do: practical batch, workshop',
      href: '/learn/c/practical',
    });
    expect(buildShelf({ ...done, remaining: ['workshop'] }).next).toEqual({ label: 'Every jar is full. Still to do: workshop', href: '/courses/c' });
    expect(buildShelf({ ...done, remaining: [] }).next?.label).toBe('Every jar is full and every requirement is met. See the course');
  });

  it("a course whose final exam is also its lessons' quiz shows no separate exam; payment and withdrawal steps", () => {
    expect(buildShelf({ ...base, finalExam: 'c--why' }).finalExam).toBeNull();
    expect(buildShelf({ ...base, status: 'awaiting_payment' }).next?.label).toMatch(/paying/);
    expect(buildShelf({ ...base, status: 'withdrawn' }).next?.label).toMatch(/withdrew/);
  });

  it('labels', () => {
    expect(jarLabel('Processing', false, false)).toBe('Processing: not read yet, quiz not passed yet');
  });
});

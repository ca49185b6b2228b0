import { QueryTypes } from 'sequelize';
import { getBank } from '@/lib/quiz/bank';
import { rightAnswer, type Answers, type Drawn } from '@/lib/quiz/grading';
import { db } from '@/models';
import { createCourses, createUser, resetDatabase } from './db';
import { actAs } from './session';

/** Enrolls a user in a course with the given status; returns the enrollment. */
export async function enroll(
  userId: number,
  courseId: number,
  status: 'active' | 'completed' | 'awaiting_payment' | 'withdrawn' = 'active',
  workshopId: number | null = null,
) {
  return db().Enrollment.create({
    userId,
    courseId,
    runKey: `r${userId}-${courseId}-${Math.random().toString(36).slice(2, 12)}`,
    status,
    feeCents: 0,
    workshopId,
  });
}

export async function drawnOf(attemptId: number): Promise<{ quizSlug: string; drawn: Drawn }> {
  const [row] = await db().sequelize.query<{ quizSlug: string; drawn: string }>('SELECT quizSlug, drawn FROM quiz_attempts WHERE id = :id', {
    replacements: { id: attemptId },
    type: QueryTypes.SELECT,
  });
  return { quizSlug: row.quizSlug, drawn: typeof row.drawn === 'string' ? JSON.parse(row.drawn) : row.drawn };
}

/**
 * The right answers of an attempt, built from the server's own key (the test plays a learner who
 * knows the material); `wrong` of them answered wrongly instead.
 */
export async function answersFor(attemptId: number, { wrong = 0 } = {}): Promise<Answers> {
  const { quizSlug, drawn } = await drawnOf(attemptId);
  const bank = getBank(quizSlug)!;
  const answers: Answers = {};
  drawn.questions.forEach((d, index) => {
    const q = bank.questions.find((x) => x.id === d.id)!;
    const right = rightAnswer(q, d);
    const spoil = index < wrong;
    if (q.kind === 'single') answers[q.id] = spoil ? (['c1', 'c2'].find((t) => t !== right.choices![0]) as string) : right.choices![0];
    else if (q.kind === 'multiple')
      answers[q.id] = spoil
        ? right.choices!.slice(0, -1).concat(right.choices!.length === 1 ? ['c1', 'c2', 'c3'].filter((t) => !right.choices!.includes(t)).slice(0, 1) : [])
        : right.choices!;
    else if (q.kind === 'true-false') answers[q.id] = spoil ? !right.value : (right.value as boolean);
    else answers[q.id] = { value: spoil ? (right.value as number) + 1000 : (right.value as number), unit: right.unit! };
  });
  return answers;
}

/** A clean database with both courses and one learner enrolled (active) in the flagship; nobody signed in. */
export async function freshLearner() {
  await resetDatabase();
  actAs(null);
  const courses = await createCourses();
  const learner = await createUser('learner');
  await enroll(learner.id, courses.flagship.id);
  return { courses, learner };
}

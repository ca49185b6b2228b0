import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { findActiveEnrollment } from '@/lib/access';
import { getCourse, getLessons } from '@/lib/content';
import type { SessionUser } from '@/lib/auth/users';
import { AppError } from '@/lib/errors';
import { roleAllows } from '@/lib/roles';
import { db } from '@/models';
import { convertUnits, getBank } from './bank';
import {
  checkAnswers,
  drawQuestions,
  gradeAttempt,
  publicQuestions,
  responseTokens,
  rightAnswer,
  type Answers,
  type Drawn,
  type Grade,
  type PublicQuestion,
} from './grading';
import type { Bank } from './schema';

// Starting, submitting and reading quiz attempts. Every rule is enforced here, on the server.

/** Answers that arrive this long after the deadline still count (network delay, a slow click). */
export const DEADLINE_GRACE_MS = 15_000;

type AttemptRow = {
  id: number;
  userId: number;
  courseId: number;
  quizSlug: string;
  drawn: Drawn | string;
  answers: StoredAnswers | string | null;
  scorePct: string | number | null;
  passed: number | boolean | null;
  startedAt: Date;
  deadlineAt: Date | null;
  submittedAt: Date | null;
};

/** What quiz_attempts.answers holds once graded. */
type StoredAnswers = { given: Answers; grade: Grade; late?: boolean };

const json = <T>(v: T | string): T => (typeof v === 'string' ? (JSON.parse(v) as T) : v);

/** The stored draw; rows written by other means (e.g. imported history) may hold no draw at all. */
function drawnOf(v: AttemptRow['drawn']): Drawn {
  const d = json<unknown>(v);
  return d && typeof d === 'object' && Array.isArray((d as Drawn).questions) ? (d as Drawn) : { questions: [] };
}

function storedOf(v: AttemptRow['answers']): StoredAnswers | null {
  const a = v === null ? null : json<unknown>(v);
  return a && typeof a === 'object' && (a as StoredAnswers).grade && Array.isArray((a as StoredAnswers).grade.results) ? (a as StoredAnswers) : null;
}

export type AttemptView = {
  id: number;
  quizSlug: string;
  title: string;
  courseSlug: string;
  lessonSlug: string | null;
  passMarkPct: number;
  startedAt: string;
  deadlineAt: string | null;
  submittedAt: string | null;
  questions: PublicQuestion[];
  result?: AttemptResult;
};

export type AttemptResult = {
  scorePct: number;
  passed: boolean;
  correct: number;
  total: number;
  late: boolean;
  questions: {
    id: string;
    correct: boolean;
    answered: boolean;
    given: string[] | boolean | { value: number; unit: string } | null;
    right: ReturnType<typeof rightAnswer>;
    explanation: string;
  }[];
};

function requireBank(quizSlug: string): Bank {
  const bank = getBank(quizSlug);
  if (!bank) throw new AppError('not_found', 'There is no quiz with that name.');
  return bank;
}

async function courseFor(slug: string, transaction?: Transaction) {
  const course = await db().Course.findOne({ where: { slug }, attributes: ['id'], transaction });
  if (!course) throw new AppError('not_found', 'The course of this quiz is not in the catalog.');
  return course;
}

/** The pass mark from the course's front matter (default 80 %). */
export function passMarkFor(courseSlug: string): number {
  return getCourse(courseSlug)?.passMarkPct ?? 80;
}

function view(row: AttemptRow, bank: Bank, passMarkPct: number, withResult: boolean): AttemptView {
  const drawn = drawnOf(row.drawn);
  const out: AttemptView = {
    id: row.id,
    quizSlug: row.quizSlug,
    title: bank.title,
    courseSlug: bank.course,
    lessonSlug: bank.lesson ?? null,
    passMarkPct,
    startedAt: new Date(row.startedAt).toISOString(),
    deadlineAt: row.deadlineAt ? new Date(row.deadlineAt).toISOString() : null,
    submittedAt: row.submittedAt ? new Date(row.submittedAt).toISOString() : null,
    questions: publicQuestions(bank.questions, drawn),
  };
  const stored = withResult && row.submittedAt ? storedOf(row.answers) : null;
  if (stored) {
    const byId = new Map(bank.questions.map((q) => [q.id, q]));
    const shown = new Map(drawn.questions.map((d) => [d.id, d]));
    out.result = {
      scorePct: stored.grade.scorePct,
      passed: stored.grade.passed,
      correct: stored.grade.correct,
      total: stored.grade.total,
      late: stored.late ?? false,
      questions: stored.grade.results.flatMap((r) => {
        const q = byId.get(r.id);
        const d = shown.get(r.id);
        if (!q || !d) return [];
        const raw = stored.given[r.id];
        const given =
          raw === undefined
            ? null
            : q.kind === 'single' || q.kind === 'multiple'
              ? responseTokens(d, r.response)
              : (raw as boolean | { value: number; unit: string });
        return [{ id: r.id, correct: r.correct, answered: r.answered, given, right: rightAnswer(q, d), explanation: q.explanation }];
      }),
    };
  }
  return out;
}

export type StartResult = { attempt: AttemptView; created: boolean };

/**
 * The questions a bank may ask an enrollment begun under `contentVersion`: a final exam leaves out
 * the questions of lessons added to the course later, which that enrollment is not required to read.
 */
export function questionPool(bank: Bank, contentVersion: number): Bank['questions'] {
  const later = getLessons(bank.course).filter((l) => l.since > contentVersion && l.quiz !== bank.slug);
  if (later.length === 0) return bank.questions;
  const skip = new Set(later.flatMap((l) => getBank(l.quiz)?.questions.map((q) => q.id) ?? []));
  return bank.questions.filter((q) => !skip.has(q.id));
}

/**
 * Starts an attempt for an enrolled learner, or returns the one still open. Refuses (429, with
 * nextAttemptAt) when the bank's attempt limit is reached in its window.
 */
export async function startAttempt(user: SessionUser, quizSlug: string, now = new Date(), random: () => number = Math.random): Promise<StartResult> {
  const bank = requireBank(quizSlug);
  const enrollment = await findActiveEnrollment(user.id, bank.course);
  if (!enrollment) throw new AppError('forbidden', 'Enroll in this course to take its quizzes.');
  const course = await courseFor(bank.course);
  const { sequelize, QuizAttempt } = db();
  return sequelize.transaction(async (transaction) => {
    // Serialises the starts of one learner, so two tabs cannot both slip under the limit.
    // Raw SQL: a row lock only (FOR UPDATE on the learner's id).
    await sequelize.query('SELECT id FROM users WHERE id = :id FOR UPDATE', { replacements: { id: user.id }, type: QueryTypes.SELECT, transaction });
    // Raw SQL: the same AttemptRow shape the submit path reads raw, so one mapper serves both.
    const open = await sequelize.query<AttemptRow>(
      `SELECT * FROM quiz_attempts WHERE userId = :userId AND quizSlug = :quizSlug AND submittedAt IS NULL
          AND (deadlineAt IS NULL OR deadlineAt > :now) ORDER BY startedAt DESC LIMIT 1`,
      { replacements: { userId: user.id, quizSlug, now }, type: QueryTypes.SELECT, transaction },
    );
    if (open[0]) return { attempt: view(open[0], bank, passMarkFor(bank.course), false), created: false };

    if (bank.attemptLimit) {
      const since = new Date(now.getTime() - bank.attemptLimit.windowHours * 3_600_000);
      // Raw SQL: start times only, inside the locking transaction.
      const recent = await sequelize.query<{ startedAt: Date }>(
        'SELECT startedAt FROM quiz_attempts WHERE userId = :userId AND quizSlug = :quizSlug AND startedAt > :since ORDER BY startedAt ASC',
        { replacements: { userId: user.id, quizSlug, since }, type: QueryTypes.SELECT, transaction },
      );
      if (recent.length >= bank.attemptLimit.max) {
        const oldest = new Date(recent[recent.length - bank.attemptLimit.max].startedAt);
        const nextAttemptAt = new Date(oldest.getTime() + bank.attemptLimit.windowHours * 3_600_000);
        throw new AppError(
          'rate_limit',
          `You have used the ${bank.attemptLimit.max} attempts allowed in ${bank.attemptLimit.windowHours} hours. You may try again from ${nextAttemptAt.toISOString()}.`,
          { extra: { nextAttemptAt: nextAttemptAt.toISOString(), limit: bank.attemptLimit } },
        );
      }
    }

    const pool = questionPool(bank, enrollment.contentVersion);
    const drawn = drawQuestions(pool, bank.draw, random);
    const deadlineAt = bank.timeLimitMinutes ? new Date(now.getTime() + bank.timeLimitMinutes * 60_000) : null;
    const row = await QuizAttempt.create({ userId: user.id, courseId: course.id, quizSlug, drawn, startedAt: now, deadlineAt }, { transaction });
    const plain = row.get({ plain: true }) as unknown as AttemptRow;
    return { attempt: view(plain, bank, passMarkFor(bank.course), false), created: true };
  });
}

/** The attempt with the workshop of the learner's current enrollment in its course (one statement). */
// Raw SQL: the correlated subquery keeps the submit's read to one round trip (grading figure, `npm run bench:grading`).
async function attemptWithWorkshop(id: number): Promise<(AttemptRow & { workshopId: number | null }) | null> {
  const rows = await db().sequelize.query<AttemptRow & { workshopId: number | null }>(
    `SELECT qa.*, (SELECT e.workshopId FROM enrollments e WHERE e.userId = qa.userId AND e.courseId = qa.courseId AND e.status IN ('active', 'completed')
                    ORDER BY e.createdAt DESC LIMIT 1) AS workshopId
       FROM quiz_attempts qa WHERE qa.id = :id`,
    { replacements: { id }, type: QueryTypes.SELECT },
  );
  return rows[0] ?? null;
}

/**
 * Stores a grade unless the attempt was graded meanwhile, in ONE statement: a MariaDB compound
 * statement (BEGIN NOT ATOMIC … END, a single statement on the wire) holding a transaction that
 * sets the result on the attempt only while it is still open (`submittedAt IS NULL`; a second
 * submission waits on the row lock of the first and then finds it closed), inserts every answer row
 * in one multi-row INSERT only if that UPDATE took, and commits. Any error rolls the whole
 * transaction back (the EXIT HANDLER) and reaches the caller. Returns whether this call stored the grade.
 */
// Raw SQL: one compound statement instead of a Sequelize transaction's five round trips serves the grading figure.
async function storeGradeOnce(row: AttemptRow & { workshopId: number | null }, stored: StoredAnswers, grade: Grade, now: Date): Promise<boolean> {
  const replacements: unknown[] = [JSON.stringify(stored), grade.scorePct, grade.passed, now, now, row.id];
  // The workshop the answers count towards: that of the learner's current enrollment in the course.
  const answerRows = grade.results.map((r) => {
    replacements.push(row.id, row.courseId, row.workshopId ?? null, row.quizSlug, r.id, r.correct, r.response?.slice(0, 200) ?? null, now);
    return '(?, ?, ?, ?, ?, ?, ?, ?)';
  });
  const insert = answerRows.length
    ? `INSERT INTO quiz_answers (attemptId, courseId, workshopId, quizSlug, questionId, correct, response, submittedAt) VALUES ${answerRows.join(', ')};`
    : 'DO 0;';
  // Raw SQL: one MariaDB compound statement (BEGIN NOT ATOMIC) holds the submit's transaction in one round trip (grading figure).
  const result = await db().sequelize.query(
    `BEGIN NOT ATOMIC
       DECLARE stored INT DEFAULT 0;
       DECLARE EXIT HANDLER FOR SQLEXCEPTION BEGIN ROLLBACK; RESIGNAL; END;
       START TRANSACTION;
       UPDATE quiz_attempts SET answers = ?, scorePct = ?, passed = ?, submittedAt = ?, updatedAt = ? WHERE id = ? AND submittedAt IS NULL;
       SET stored = ROW_COUNT();
       IF stored = 1 THEN ${insert} END IF;
       COMMIT;
       SELECT stored;
     END`,
    { replacements, type: QueryTypes.RAW },
  );
  return Number(firstRow(result)?.stored) === 1;
}

/** The first row of the first result set in what the driver returns for a compound statement. */
function firstRow(result: unknown): Record<string, unknown> | undefined {
  const queue: unknown[] = [result];
  while (queue.length) {
    const item = queue.shift();
    if (Array.isArray(item)) queue.push(...item);
    else if (item && typeof item === 'object' && 'stored' in item) return item as Record<string, unknown>;
  }
  return undefined;
}

export type SubmitResult = { attempt: AttemptView; graded: boolean };

/**
 * Grades an attempt once: two statements, the read and the write (storeGradeOnce). A second
 * submission (two tabs, a double click) that arrives after the first was stored reads the result and
 * returns it; one that races the first loses at the write and returns the result the first stored.
 * Late answers (past the deadline and its grace) are not counted: the attempt is closed with what
 * arrived in time, i.e. nothing, and a 409 says so.
 */
export async function submitAttempt(user: SessionUser, attemptId: number, answers: Answers, now = new Date()): Promise<SubmitResult> {
  const row = await attemptWithWorkshop(attemptId);
  if (!row) throw new AppError('not_found', 'There is no such attempt.');
  if (row.userId !== user.id) throw new AppError('forbidden', 'This attempt belongs to another learner.');
  const bank = requireBank(row.quizSlug);
  const passMarkPct = passMarkFor(bank.course);
  if (row.submittedAt) return { attempt: view(row, bank, passMarkPct, true), graded: false };

  const drawn = drawnOf(row.drawn);
  checkAnswers(bank.questions, drawn, answers);
  const late = row.deadlineAt !== null && now.getTime() > new Date(row.deadlineAt).getTime() + DEADLINE_GRACE_MS;
  const counted: Answers = late ? {} : answers;
  const grade = gradeAttempt(bank.questions, drawn, counted, passMarkPct, convertUnits);
  const stored: StoredAnswers = { given: counted, grade, ...(late ? { late: true } : {}) };

  if (!(await storeGradeOnce(row, stored, grade, now))) {
    const first = await attemptWithWorkshop(attemptId);
    if (!first) throw new AppError('not_found', 'There is no such attempt.');
    return { attempt: view(first, bank, passMarkPct, true), graded: false };
  }
  const attempt = view({ ...row, answers: stored, scorePct: grade.scorePct, passed: grade.passed, submittedAt: now }, bank, passMarkPct, true);
  if (late) {
    throw new AppError('conflict', 'The time limit for this attempt ran out before the answers arrived, so they were not counted.', {
      extra: { deadlineAt: attempt.deadlineAt, attempt },
    });
  }
  return { attempt, graded: true };
}

/** An attempt for its owner, an instructor or a coordinator; the result only once submitted. */
export async function readAttempt(user: SessionUser, attemptId: number): Promise<AttemptView> {
  // Raw SQL: the same AttemptRow shape as the submit path's read, so one mapper serves both.
  const rows = await db().sequelize.query<AttemptRow>('SELECT * FROM quiz_attempts WHERE id = :id', {
    replacements: { id: attemptId },
    type: QueryTypes.SELECT,
  });
  const row = rows[0];
  if (!row) throw new AppError('not_found', 'There is no such attempt.');
  const staff = roleAllows(user.roles, ['instructor']);
  if (row.userId !== user.id && !staff) throw new AppError('forbidden', 'This attempt belongs to another learner.');
  const bank = requireBank(row.quizSlug);
  return view(row, bank, passMarkFor(bank.course), true);
}

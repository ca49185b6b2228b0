import 'server-only';
import { QueryTypes } from 'sequelize';
import { z } from 'zod';
import { db } from '@/models';
import { getBanks } from './bank';
import type { ResolvedQuestion } from './schema';

// How each question of each quiz is answered, for instructors and coordinators.

const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date such as 2026-12-01.');
export const ResultsFilterSchema = z
  .object({
    workshop: z.coerce.number().int().positive().optional(),
    from: day.optional(),
    to: day.optional(),
    quiz: z
      .string()
      .regex(/^[a-z0-9-]+$/)
      .optional(),
  })
  .refine((f) => !f.from || !f.to || f.from <= f.to, { message: 'The start date must not be after the end date.', path: ['to'] });
export type ResultsFilter = z.infer<typeof ResultsFilterSchema>;

export type QuestionStat = {
  quizSlug: string;
  quizTitle: string;
  questionId: string;
  prompt: string;
  attempts: number;
  right: number;
  rightPct: number;
  unanswered: number;
  topWrong: string | null;
  topWrongCount: number;
};

type Row = {
  quizSlug: string;
  questionId: string;
  attempts: number | string;
  rightCount: number | string;
  unanswered: number | string;
  topWrong: string | null;
  topWrongCount: number | string | null;
};

/**
 * Every question's figures in ONE aggregated query: answers, % right, unanswered, and the most
 * chosen wrong answer (a window function ranks the wrong responses of each question).
 */
// Raw SQL: one aggregated statement with a window function (the most frequent wrong answer), which Sequelize's query builder cannot express.
export async function fetchQuestionResults(filter: ResultsFilter): Promise<QuestionStat[]> {
  const where: string[] = [];
  const replacements: Record<string, unknown> = {};
  if (filter.workshop) {
    where.push('workshopId = :workshop');
    replacements.workshop = filter.workshop;
  }
  if (filter.from) {
    where.push('submittedAt >= :from');
    replacements.from = new Date(`${filter.from}T00:00:00Z`);
  }
  if (filter.to) {
    where.push('submittedAt < :to');
    replacements.to = new Date(new Date(`${filter.to}T00:00:00Z`).getTime() + 86_400_000);
  }
  if (filter.quiz) {
    where.push('quizSlug = :quiz');
    replacements.quiz = filter.quiz;
  }
  // Raw SQL: one aggregated query with a CTE and window functions (per-question results), which Sequelize cannot express.
  const rows = await db().sequelize.query<Row>(
    `WITH filtered AS (
       SELECT quizSlug, questionId, correct, response FROM quiz_answers ${where.length ? `WHERE ${where.join(' AND ')}` : ''}
     ),
     per_question AS (
       SELECT quizSlug, questionId, COUNT(*) AS attempts, SUM(correct) AS rightCount, SUM(response IS NULL) AS unanswered
         FROM filtered GROUP BY quizSlug, questionId
     ),
     wrong AS (
       SELECT quizSlug, questionId, response, COUNT(*) AS n,
              ROW_NUMBER() OVER (PARTITION BY quizSlug, questionId ORDER BY COUNT(*) DESC, response ASC) AS rk
         FROM filtered WHERE correct = 0 AND response IS NOT NULL GROUP BY quizSlug, questionId, response
     )
     SELECT p.quizSlug, p.questionId, p.attempts, p.rightCount, p.unanswered, w.response AS topWrong, w.n AS topWrongCount
       FROM per_question p LEFT JOIN wrong w ON w.quizSlug = p.quizSlug AND w.questionId = p.questionId AND w.rk = 1
      ORDER BY p.quizSlug, p.questionId`,
    { replacements, type: QueryTypes.SELECT },
  );
  return rows.map((r) => toStat(r));
}

let questionIndex: Map<string, { quizTitle: string; question: ResolvedQuestion }> | null = null;
function lookup(quizSlug: string, questionId: string) {
  if (!questionIndex) {
    questionIndex = new Map();
    // A lesson question answered inside the final exam is listed under the exam; titles come from that bank.
    for (const bank of getBanks()) for (const q of bank.questions) questionIndex.set(`${bank.slug}/${q.id}`, { quizTitle: bank.title, question: q });
  }
  return questionIndex.get(`${quizSlug}/${questionId}`) ?? null;
}

/** A stored response in words: the choice text, True/False, or the number and unit. */
export function describeResponse(question: ResolvedQuestion | undefined, response: string | null): string | null {
  if (response === null) return null;
  if (!question) return response;
  if (question.kind === 'single' || question.kind === 'multiple') {
    const ids = response.split(',');
    return ids.map((id) => question.choices.find((c) => c.id === id)?.text ?? id).join(' + ');
  }
  if (question.kind === 'true-false') return response === 'true' ? 'True' : 'False';
  return response;
}

function toStat(r: Row): QuestionStat {
  const found = lookup(r.quizSlug, r.questionId);
  const attempts = Number(r.attempts);
  const right = Number(r.rightCount);
  return {
    quizSlug: r.quizSlug,
    quizTitle: found?.quizTitle ?? r.quizSlug,
    questionId: r.questionId,
    prompt: found?.question.prompt ?? r.questionId,
    attempts,
    right,
    rightPct: attempts ? Math.round((right / attempts) * 1000) / 10 : 0,
    unanswered: Number(r.unanswered),
    topWrong: describeResponse(found?.question, r.topWrong),
    topWrongCount: Number(r.topWrongCount ?? 0),
  };
}

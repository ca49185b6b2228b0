import { requireRole } from '@/lib/auth/guard';
import { route } from '@/lib/errors';
import { startAttempt } from '@/lib/quiz/attempts';
import { parseQuizSlug } from '@/lib/validations/quiz-params';

type Context = { params: Promise<{ quiz: string }> };

/** Starts an attempt (201), or returns the learner's open one (200). The questions carry no key. */
export const POST = route<Context>(async (_request, context) => {
  const user = await requireRole('learner');
  const quiz = parseQuizSlug((await context.params).quiz);
  const { attempt, created } = await startAttempt(user, quiz);
  return Response.json({ attempt }, { status: created ? 201 : 200, headers: { 'cache-control': 'no-store' } });
});

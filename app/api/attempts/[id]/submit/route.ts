import { requireRole } from '@/lib/auth/guard';
import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { submitAttempt } from '@/lib/quiz/attempts';
import { SubmitSchema } from '@/lib/validations/quiz';
import { parseAttemptId } from '@/lib/validations/quiz-params';

type Context = { params: Promise<{ id: string }> };

/** Grades an attempt on the server, once; a repeated submit returns the same result. */
export const POST = route<Context>(async (request, context) => {
  const user = await requireRole('learner');
  const id = parseAttemptId((await context.params).id);
  const { answers } = parseOrThrow(SubmitSchema, await readJson(request), 'answers');
  const { attempt, graded } = await submitAttempt(user, id, answers);
  return Response.json({ attempt, graded }, { headers: { 'cache-control': 'no-store' } });
});

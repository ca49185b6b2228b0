import { requireRole } from '@/lib/auth/guard';
import { route } from '@/lib/errors';
import { readAttempt } from '@/lib/quiz/attempts';
import { parseAttemptId } from '@/lib/validations/quiz-params';

type Context = { params: Promise<{ id: string }> };

/** One attempt, for its owner, instructors and coordinators; right answers only once submitted. */
export const GET = route<Context>(async (_request, context) => {
  const user = await requireRole();
  const id = parseAttemptId((await context.params).id);
  const attempt = await readAttempt(user, id);
  return Response.json({ attempt }, { headers: { 'cache-control': 'no-store' } });
});

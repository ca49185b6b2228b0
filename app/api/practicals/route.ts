import { requireRole } from '@/lib/auth/guard';
import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { submitPractical } from '@/lib/practicals/service';
import { practicalSubmissionSchema } from '@/lib/validations/practical';

export const POST = route(async (request) => {
  const user = await requireRole('learner');
  const body = parseOrThrow(practicalSubmissionSchema, await readJson(request), 'practical');
  const practical = await submitPractical(user, body.course, body.practical);
  return Response.json({ practical }, { status: 201 });
});

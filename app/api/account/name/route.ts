import { changeName } from '@/lib/account/profile';
import { requireRole } from '@/lib/auth/guard';
import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { ChangeNameSchema } from '@/lib/validations/account';

// Any signed-in person: the name printed on certificates issued from now on.
export const POST = route(async (request) => {
  const user = await requireRole();
  const input = parseOrThrow(ChangeNameSchema, await readJson(request), 'name');
  return Response.json(await changeName(user.id, input));
});

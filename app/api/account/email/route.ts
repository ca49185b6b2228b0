import { requestEmailChange } from '@/lib/account/profile';
import { requireRole } from '@/lib/auth/guard';
import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { ChangeEmailSchema } from '@/lib/validations/account';

// Any signed-in person, with the present password: nothing changes until the new address confirms.
export const POST = route(async (request) => {
  const user = await requireRole();
  const input = parseOrThrow(ChangeEmailSchema, await readJson(request), 'e-mail change');
  await requestEmailChange(user.id, input);
  return Response.json(
    { message: `We have sent a link to ${input.newEmail}. Your address changes when you open it; until then it stays as it is.` },
    { status: 202 },
  );
});

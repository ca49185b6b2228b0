import { signOutEverywhere } from '@/lib/account/profile';
import { requireRole } from '@/lib/auth/guard';
import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { SignOutEverywhereSchema } from '@/lib/validations/account';

// Any signed-in person: every session of the account ends, this one too.
export const POST = route(async (request) => {
  const user = await requireRole();
  parseOrThrow(SignOutEverywhereSchema, await readJson(request), 'request');
  await signOutEverywhere(user.id);
  return Response.json({ message: 'Every session of your account is signed out.' });
});

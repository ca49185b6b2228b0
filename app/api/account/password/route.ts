import { changePassword } from '@/lib/account/profile';
import { requireRole } from '@/lib/auth/guard';
import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { ChangePasswordSchema } from '@/lib/validations/account';

// Any signed-in person, with the present password; every session ends (the form signs in again).
export const POST = route(async (request) => {
  const user = await requireRole();
  const input = parseOrThrow(ChangePasswordSchema, await readJson(request), 'password change');
  await changePassword(user.id, input);
  return Response.json({ message: 'Your password is changed, and every other session is signed out.' });
});

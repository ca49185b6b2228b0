import { resetPassword } from '@/lib/account/reset';
import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { ResetPasswordSchema } from '@/lib/validations/account';

// Anyone holding a live link: the new password, once; a used or expired link is a 409 that says so.
export const POST = route(async (request) => {
  const input = parseOrThrow(ResetPasswordSchema, await readJson(request), 'new password');
  await resetPassword(input);
  return Response.json({ message: 'Your password is changed. Sign in with the new one.' });
});

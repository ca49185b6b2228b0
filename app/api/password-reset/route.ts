import { RESET_REQUESTED, requestPasswordReset } from '@/lib/account/reset';
import { clientAddress } from '@/lib/auth/options';
import { parseOrThrow, route } from '@/lib/errors';
import { readJson } from '@/lib/server/body';
import { ResetRequestSchema } from '@/lib/validations/account';

// Anyone: the same 202 whether or not an account uses the address (throttled per address typed and per client).
export const POST = route(async (request) => {
  const { email } = parseOrThrow(ResetRequestSchema, await readJson(request), 'reset request');
  await requestPasswordReset(email, clientAddress(request.headers));
  return Response.json({ message: RESET_REQUESTED }, { status: 202 });
});

import { resendConfirmation } from '@/lib/account/profile';
import { requireRole } from '@/lib/auth/guard';
import { route } from '@/lib/errors';

// Any signed-in person whose address is not confirmed yet: the confirmation e-mail again (throttled).
export const POST = route(async () => {
  const user = await requireRole();
  await resendConfirmation(user.id);
  return Response.json({ message: `We have sent the confirmation e-mail again to ${user.email}.` }, { status: 202 });
});

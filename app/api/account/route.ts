import { eraseAccount, STAFF_DELETION } from '@/lib/account/data';
import { requireRole } from '@/lib/auth/guard';
import { AppError, parseOrThrow, route } from '@/lib/errors';
import { holdsStaffRole } from '@/lib/roles';
import { readJson } from '@/lib/server/body';
import { DeleteAccountSchema } from '@/lib/validations/account';

// A learner, with the present password and the word DELETE: the account is erased (staff accounts are closed by an admin).
export const DELETE = route(async (request) => {
  const user = await requireRole('learner');
  if (holdsStaffRole(user.roles)) throw new AppError('forbidden', STAFF_DELETION);
  const input = parseOrThrow(DeleteAccountSchema, await readJson(request), 'deletion request');
  await eraseAccount(user.id, input.currentPassword);
  return Response.json({ message: 'Your account is deleted. What the program must keep is kept under a pseudonym, as the privacy page says.' });
});

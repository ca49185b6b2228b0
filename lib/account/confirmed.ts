import 'server-only';
import { AppError } from '@/lib/errors';
import { db } from '@/models';

export const UNCONFIRMED_MESSAGE =
  'Please confirm your e-mail address first: open the link in the message we sent you, or send it again from your account page (Account, then "Send the confirmation e-mail again").';

/** 403 unless the account's e-mail address is confirmed (enrolling, receiving a certificate). */
export async function requireConfirmedAddress(userId: number): Promise<void> {
  const user = await db().User.findByPk(userId, { attributes: ['emailVerifiedAt'] });
  if (!user?.emailVerifiedAt) throw new AppError('forbidden', UNCONFIRMED_MESSAGE, { extra: { reason: 'email_unconfirmed' } });
}

import 'server-only';
import { audit } from '@/lib/audit';
import { endSessions } from '@/lib/auth/sessions';
import { hashPassword } from '@/lib/auth/users';
import { enqueueEmail } from '@/lib/email/outbox';
import { passwordChangedEmail, passwordResetEmail } from '@/lib/email/templates';
import { getEnv } from '@/lib/env';
import { AppError } from '@/lib/errors';
import { takeOrThrow } from '@/lib/throttle';
import type { ResetPasswordInput } from '@/lib/validations/account';
import { db } from '@/models';
import { appLink, issueToken, readToken, type TokenState } from './tokens';

export const RESET_VALID_MINUTES = 60;

/** The one answer to a reset request, whether or not the address has an account. */
export const RESET_REQUESTED =
  'If an account uses that address, we have sent it a link to choose a new password. It works once, for an hour. Check your spam folder if nothing arrives.';

/**
 * Counts the request per address typed and per client address (429 past either, for known and
 * unknown addresses alike), then e-mails a single-use link when an active account uses the address.
 */
export async function requestPasswordReset(emailAddress: string, clientAddress: string): Promise<void> {
  const env = getEnv();
  const windowSeconds = env.RESET_WINDOW_MINUTES * 60;
  await takeOrThrow(
    [
      { bucket: `reset:account:${emailAddress}`, max: env.RESET_MAX_PER_ACCOUNT, windowSeconds },
      { bucket: `reset:address:${clientAddress}`, max: env.RESET_MAX_PER_ADDRESS, windowSeconds },
    ],
    'Too many password reset requests. Please wait an hour and try again, or ask the program coordinator for help.',
  );
  const { User, sequelize } = db();
  const user = await User.findOne({ where: { email: emailAddress } });
  if (!user || user.deactivatedAt || user.erasedAt) return;
  await sequelize.transaction(async (transaction) => {
    const token = await issueToken(user.id, 'password_reset', { validMinutes: RESET_VALID_MINUTES, transaction });
    const message = passwordResetEmail({ to: user.email, name: user.name, resetUrl: appLink('/reset-password', token), validMinutes: RESET_VALID_MINUTES });
    await enqueueEmail(message, { transaction });
    await audit({ actorId: null, action: 'user.password_reset_requested', subjectType: 'user', subjectId: user.id }, { transaction });
  });
}

/** What the reset page shows for a link, before anything is typed. */
export async function resetLinkState(token: string): Promise<TokenState['state']> {
  return (await readToken(token, 'password_reset')).state;
}

const LINK_REFUSED: Record<'used' | 'expired' | 'invalid', string> = {
  used: 'This link has already been used, or a newer one replaced it. Ask for a new one.',
  expired: 'This link has expired: links work for an hour. Ask for a new one.',
  invalid: 'This link does not work. Copy the whole link from the e-mail, or ask for a new one.',
};

/**
 * Sets a new password through a reset link, once: the token is locked and marked used in the same
 * transaction, every session ends, the address counts as confirmed (the link reached it).
 */
export async function resetPassword(input: ResetPasswordInput): Promise<void> {
  const { User, sequelize } = db();
  const passwordHash = await hashPassword(input.password);
  await sequelize.transaction(async (transaction) => {
    const link = await readToken(input.token, 'password_reset', { transaction });
    if (link.state !== 'valid') throw new AppError('conflict', LINK_REFUSED[link.state], { extra: { link: link.state } });
    const user = await User.findByPk(link.row.userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user || user.deactivatedAt || user.erasedAt) throw new AppError('conflict', LINK_REFUSED.invalid, { extra: { link: 'invalid' } });
    await link.row.update({ usedAt: new Date() }, { transaction });
    await user.update({ passwordHash, emailVerifiedAt: user.emailVerifiedAt ?? new Date() }, { transaction });
    await endSessions(user.id, transaction);
    await enqueueEmail(passwordChangedEmail({ to: user.email, name: user.name, appUrl: getEnv().APP_URL }), { transaction });
    await audit({ actorId: user.id, action: 'user.password_reset', subjectType: 'user', subjectId: user.id }, { transaction });
  });
}

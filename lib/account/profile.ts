import 'server-only';
import bcrypt from 'bcryptjs';
import { UniqueConstraintError } from 'sequelize';
import { audit } from '@/lib/audit';
import { endSessions } from '@/lib/auth/sessions';
import { hashPassword } from '@/lib/auth/users';
import { enqueueEmail } from '@/lib/email/outbox';
import { emailChangeConfirmEmail, emailChangeNoticeEmail, confirmAddressEmail, passwordChangedEmail } from '@/lib/email/templates';
import { confirmUrlFor } from '@/lib/email/welcome';
import { getEnv } from '@/lib/env';
import { AppError } from '@/lib/errors';
import { giveBack, takeOrThrow } from '@/lib/throttle';
import type { ChangeEmailInput, ChangeNameInput, ChangePasswordInput } from '@/lib/validations/account';
import { db, type User } from '@/models';
import { appLink, issueToken, readToken } from './tokens';

export const EMAIL_CHANGE_VALID_HOURS = 24;

/** What the account page shows about its holder. */
export type AccountView = {
  name: string;
  email: string;
  confirmed: boolean;
  pendingEmail: string | null;
  issuedCertificates: number;
};

export async function readAccount(userId: number): Promise<AccountView> {
  const { User, AccountToken, Certificate } = db();
  const [user, pending, issuedCertificates] = await Promise.all([
    User.findByPk(userId, { rejectOnEmpty: true }),
    AccountToken.findOne({ where: { userId, purpose: 'email_change', usedAt: null }, order: [['id', 'DESC']] }),
    Certificate.count({ where: { userId } }),
  ]);
  const live = pending && pending.expiresAt.getTime() > Date.now() ? pending.newEmail : null;
  return { name: user.name, email: user.email, confirmed: Boolean(user.emailVerifiedAt), pendingEmail: live, issuedCertificates };
}

/**
 * Checks the holder's present password before a change; wrong guesses are counted per account
 * (the sign-in limits), so a session left open cannot be used to find the password.
 */
export async function checkPresentPassword(user: User, plain: string): Promise<void> {
  const env = getEnv();
  const limit = { bucket: `account-password:${user.id}`, max: env.SIGNIN_MAX_PER_ACCOUNT_ADDRESS, windowSeconds: env.SIGNIN_WINDOW_MINUTES * 60 };
  await takeOrThrow([limit], 'Too many wrong passwords. Please wait a few minutes and try again.');
  if (!(await bcrypt.compare(plain, user.passwordHash))) {
    throw new AppError('forbidden', 'That is not your present password.', { fields: { currentPassword: ['That is not your present password.'] } });
  }
  await giveBack([limit]);
}

/** Counts a message the account sends itself (confirmation, e-mail change); 429 past the limit. */
async function countAccountMail(userId: number): Promise<void> {
  const env = getEnv();
  await takeOrThrow(
    [{ bucket: `account-mail:${userId}`, max: env.ACCOUNT_MAIL_MAX_PER_ACCOUNT, windowSeconds: env.ACCOUNT_MAIL_WINDOW_MINUTES * 60 }],
    'Too many messages sent for this account in the last hour. Please wait and try again.',
  );
}

const loadUser = (userId: number) => db().User.findByPk(userId, { rejectOnEmpty: new AppError('unauthorized') });

/** Changes the password with the present one; every session ends (the caller signs in again). */
export async function changePassword(userId: number, input: ChangePasswordInput): Promise<void> {
  const user = await loadUser(userId);
  await checkPresentPassword(user, input.currentPassword);
  const passwordHash = await hashPassword(input.newPassword);
  await db().sequelize.transaction(async (transaction) => {
    await user.update({ passwordHash }, { transaction });
    await endSessions(user.id, transaction);
    await enqueueEmail(passwordChangedEmail({ to: user.email, name: user.name, appUrl: getEnv().APP_URL }), { transaction });
    await audit({ actorId: user.id, action: 'user.password_changed', subjectType: 'user', subjectId: user.id }, { transaction });
  });
}

const TAKEN = 'Another account already uses that e-mail address.';

/** Asks for an e-mail change: a link to the new address, a notice to the present one, nothing changed yet. */
export async function requestEmailChange(userId: number, input: ChangeEmailInput): Promise<void> {
  const { User, sequelize } = db();
  const user = await loadUser(userId);
  await checkPresentPassword(user, input.currentPassword);
  if (input.newEmail === user.email)
    throw new AppError('conflict', 'That is already your e-mail address.', { fields: { newEmail: ['That is already your e-mail address.'] } });
  if (await User.count({ where: { email: input.newEmail } })) throw new AppError('conflict', TAKEN, { fields: { newEmail: [TAKEN] } });
  await countAccountMail(user.id);
  const appUrl = getEnv().APP_URL;
  await sequelize.transaction(async (transaction) => {
    const token = await issueToken(user.id, 'email_change', { validMinutes: EMAIL_CHANGE_VALID_HOURS * 60, newEmail: input.newEmail, transaction });
    const confirmUrl = appLink('/confirm-email-change', token);
    await enqueueEmail(emailChangeConfirmEmail({ to: input.newEmail, name: user.name, confirmUrl, validHours: EMAIL_CHANGE_VALID_HOURS }), { transaction });
    await enqueueEmail(emailChangeNoticeEmail({ to: user.email, name: user.name, newEmail: input.newEmail, appUrl }), { transaction });
    await audit({ actorId: user.id, action: 'user.email_change_requested', subjectType: 'user', subjectId: user.id }, { transaction });
  });
}

export type EmailChangeOutcome = 'changed' | 'used' | 'expired' | 'invalid' | 'taken';

/** Opens an e-mail change link: the address changes and counts as confirmed, and every session ends. */
export async function confirmEmailChange(token: string): Promise<EmailChangeOutcome> {
  const { User, sequelize } = db();
  try {
    return await sequelize.transaction(async (transaction) => {
      const link = await readToken(token, 'email_change', { transaction });
      if (link.state !== 'valid') return link.state;
      const user = await User.findByPk(link.row.userId, { transaction, lock: transaction.LOCK.UPDATE });
      if (!user || user.deactivatedAt || user.erasedAt || !link.row.newEmail) return 'invalid';
      await link.row.update({ usedAt: new Date() }, { transaction });
      await user.update({ email: link.row.newEmail, emailVerifiedAt: new Date() }, { transaction });
      await endSessions(user.id, transaction);
      await audit({ actorId: user.id, action: 'user.email_changed', subjectType: 'user', subjectId: user.id }, { transaction });
      return 'changed';
    });
  } catch (error) {
    // Another account took the address between the request and the click.
    if (error instanceof UniqueConstraintError) return 'taken';
    throw error;
  }
}

/**
 * Changes the name used on certificates from now on; issued ones keep the name they carry, so the
 * answer says when a reissue is worth asking the coordinator for.
 */
export async function changeName(userId: number, input: ChangeNameInput): Promise<{ name: string; reissueAdvice: string | null }> {
  const user = await loadUser(userId);
  const before = user.name;
  await db().sequelize.transaction(async (transaction) => {
    await user.update({ name: input.name }, { transaction });
    await audit({ actorId: user.id, action: 'user.name_changed', subjectType: 'user', subjectId: user.id }, { transaction });
  });
  const issued = before !== input.name ? await db().Certificate.count({ where: { userId } }) : 0;
  return {
    name: user.name,
    reissueAdvice: issued
      ? 'Certificates already issued keep the name printed on them. To have one show your new name, ask the program coordinator for a reissue.'
      : null,
  };
}

/** "Sign out everywhere": every session of the account ends on its next request, this one too. */
export async function signOutEverywhere(userId: number): Promise<void> {
  await db().sequelize.transaction(async (transaction) => {
    await endSessions(userId, transaction);
    await audit({ actorId: userId, action: 'user.signed_out_everywhere', subjectType: 'user', subjectId: userId }, { transaction });
  });
}

/** Sends the confirmation message again (throttled); 409 when the address is already confirmed. */
export async function resendConfirmation(userId: number): Promise<void> {
  const user = await loadUser(userId);
  if (user.emailVerifiedAt) throw new AppError('conflict', 'Your e-mail address is already confirmed.');
  await countAccountMail(user.id);
  await enqueueEmail(confirmAddressEmail({ to: user.email, name: user.name, confirmUrl: confirmUrlFor(user) }));
}

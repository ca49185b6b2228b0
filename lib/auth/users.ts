import 'server-only';
import bcrypt from 'bcryptjs';
import { UniqueConstraintError } from 'sequelize';
import { AppError } from '@/lib/errors';
import { parseRoles, type Role } from '@/lib/roles';
import { db } from '@/models';
import { queueWelcomeEmail } from '@/lib/email/welcome';
import { getEnv } from '@/lib/env';
import { takeOrThrow } from '@/lib/throttle';
import type { RegisterInput } from '@/lib/validations/user';
import { countSignInAttempt } from './sign-in-throttle';
import type { AccountState } from './sessions';

export { ThrottledError } from './sign-in-throttle';

const COST = 10;
// Compared against when the e-mail is unknown, so both answers take the same time.
const DUMMY_HASH = bcrypt.hashSync('brinewright-no-such-account', COST);

export type SessionUser = { id: number; email: string; name: string; roles: Role[] };
/** A user who just proved their password: the session token records the account's sessionVersion. */
export type SignedInUser = SessionUser & { sessionVersion: number };

export const hashPassword = (plain: string) => bcrypt.hash(plain, COST);

/** Counts a registration from a client address (REGISTER_MAX_PER_ADDRESS per REGISTER_WINDOW_MINUTES); 429 past it. */
export async function countRegistration(address: string): Promise<void> {
  const env = getEnv();
  await takeOrThrow(
    [{ bucket: `register:${address}`, max: env.REGISTER_MAX_PER_ADDRESS, windowSeconds: env.REGISTER_WINDOW_MINUTES * 60 }],
    'Too many new accounts from your network in the last hour. Please wait and try again, or ask the program coordinator for help.',
  );
}

/** Creates a learner account; a taken e-mail is a 409 with a clear message, and no second row. */
export async function registerLearner(input: RegisterInput): Promise<SessionUser> {
  const { User, AuditLog, sequelize } = db();
  const passwordHash = await hashPassword(input.password);
  try {
    return await sequelize.transaction(async (transaction) => {
      const user = await User.create({ name: input.name, email: input.email, passwordHash, roles: ['learner'] }, { transaction });
      await AuditLog.create({ actorId: user.id, action: 'user.registered', subjectType: 'user', subjectId: String(user.id), data: null }, { transaction });
      await queueWelcomeEmail(user, transaction);
      return { id: user.id, email: user.email, name: user.name, roles: user.roles };
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) {
      throw new AppError('conflict', 'An account with that e-mail address already exists. Sign in instead, or use another address.', {
        fields: { email: ['An account with that e-mail address already exists.'] },
      });
    }
    throw error;
  }
}

/**
 * Checks an e-mail and password. The attempt is counted first (lib/auth/sign-in-throttle.ts), so
 * parallel guesses cannot race past the limit; a wrong password and an unknown e-mail give the same
 * null after the same bcrypt work; a right one takes its attempt back.
 */
export async function verifyCredentials(
  emailAddress: string,
  plain: string,
  address: string,
  options: { sleep?: (ms: number) => Promise<void> } = {},
): Promise<SignedInUser | null> {
  const takeBack = await countSignInAttempt({ email: emailAddress, address }, options);
  const user = await db().User.findOne({ where: { email: emailAddress } });
  const ok = await bcrypt.compare(plain, user?.passwordHash ?? DUMMY_HASH);
  // A deactivated account keeps its records but cannot sign in: the same answer as a wrong password.
  if (!user || !ok || user.deactivatedAt) return null;
  await takeBack();
  return { id: user.id, email: user.email, name: user.name, roles: user.roles, sessionVersion: user.sessionVersion };
}

/** The roles, session version and deactivation of a user now, or null when there is no such user (one primary-key read). */
export async function currentAccount(userId: number): Promise<AccountState | null> {
  const row = await db().User.findByPk(userId, { attributes: ['roles', 'sessionVersion', 'deactivatedAt'], raw: true });
  // raw: the SET column comes back as MariaDB writes it ('instructor,learner' in declaration order).
  return row ? { roles: parseRoles(row.roles), sessionVersion: row.sessionVersion, deactivatedAt: row.deactivatedAt } : null;
}

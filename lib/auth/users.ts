import 'server-only';
import bcrypt from 'bcryptjs';
import { UniqueConstraintError } from 'sequelize';
import { AppError } from '@/lib/errors';
import type { Role } from '@/lib/roles';
import { db } from '@/models';
import { queueWelcomeEmail } from '@/lib/email/welcome';
import type { RegisterInput } from '@/lib/validations/user';
import { clearAccount, isThrottled, recordFailure } from './throttle';

const COST = 10;
// Compared against when the e-mail is unknown, so both answers take the same time.
const DUMMY_HASH = bcrypt.hashSync('brinewright-no-such-account', COST);

export type SessionUser = { id: number; email: string; name: string; role: Role };

export const hashPassword = (plain: string) => bcrypt.hash(plain, COST);

/** Creates a learner account; a taken e-mail is a 409 with a clear message, and no second row. */
export async function registerLearner(input: RegisterInput): Promise<SessionUser> {
  const { User, AuditLog, sequelize } = db();
  const passwordHash = await hashPassword(input.password);
  try {
    return await sequelize.transaction(async (transaction) => {
      const user = await User.create({ name: input.name, email: input.email, passwordHash, role: 'learner' }, { transaction });
      await AuditLog.create({ actorId: user.id, action: 'user.registered', subjectType: 'user', subjectId: String(user.id), data: null }, { transaction });
      await queueWelcomeEmail(user, transaction);
      return { id: user.id, email: user.email, name: user.name, role: user.role };
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

export class ThrottledError extends Error {
  constructor() {
    super('Too many sign-in attempts. Please wait 15 minutes and try again.');
    this.name = 'ThrottledError';
  }
}

/**
 * Checks an e-mail and password. A wrong password and an unknown e-mail give the same null,
 * after the same bcrypt work; too many failures throw ThrottledError.
 */
export async function verifyCredentials(emailAddress: string, plain: string, address: string): Promise<SessionUser | null> {
  const keys = { account: emailAddress, address };
  if (await isThrottled(keys)) throw new ThrottledError();
  const user = await db().User.findOne({ where: { email: emailAddress } });
  const ok = await bcrypt.compare(plain, user?.passwordHash ?? DUMMY_HASH);
  if (!user || !ok) {
    await recordFailure(keys);
    return null;
  }
  await clearAccount(emailAddress);
  return { id: user.id, email: user.email, name: user.name, role: user.role };
}

/** The role a user has now, or null when there is no such user (one primary-key read). */
export async function currentRole(userId: number): Promise<Role | null> {
  const row = await db().User.findByPk(userId, { attributes: ['role'], raw: true });
  return row?.role ?? null;
}

import 'server-only';
import { audit } from '@/lib/audit';
import { getEnv } from '@/lib/env';
import { db } from '@/models';
import { checkConfirmationToken } from './confirmation';

export type ConfirmOutcome = 'confirmed' | 'already' | 'expired' | 'invalid';

/** Confirms the e-mail address a token names (sets users.emailVerifiedAt once). */
export async function confirmEmailAddress(token: string): Promise<ConfirmOutcome> {
  const { User } = db();
  const check = await checkConfirmationToken(
    token,
    getEnv().NEXTAUTH_SECRET,
    async (id) => (await User.findByPk(id, { attributes: ['email'] }))?.email ?? null,
  );
  if (!check.ok) return check.reason === 'expired' ? 'expired' : 'invalid';
  const user = (await User.findByPk(check.userId))!;
  if (user.emailVerifiedAt) return 'already';
  await db().sequelize.transaction(async (transaction) => {
    await user.update({ emailVerifiedAt: new Date() }, { transaction });
    await audit({ actorId: user.id, action: 'user.email_confirmed', subjectType: 'user', subjectId: user.id }, { transaction });
  });
  return 'confirmed';
}

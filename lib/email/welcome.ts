import 'server-only';
import type { Transaction } from 'sequelize';
import { getEnv } from '@/lib/env';
import { confirmationToken } from './confirmation';
import { enqueueEmail } from './outbox';
import { welcomeEmail } from './templates';

const CONFIRM_DAYS = 7;

/** The address a learner opens to confirm their e-mail address (valid for a week). */
export function confirmUrlFor(user: { id: number; email: string }, now = new Date()): string {
  const env = getEnv();
  const token = confirmationToken({
    userId: user.id,
    email: user.email,
    secret: env.NEXTAUTH_SECRET,
    expiresAt: new Date(now.getTime() + CONFIRM_DAYS * 86_400_000),
  });
  return `${env.APP_URL.replace(/\/$/, '')}/confirm-email?token=${encodeURIComponent(token)}`;
}

/** Queues the welcome message with the confirmation link, inside the registration's transaction. */
export async function queueWelcomeEmail(user: { id: number; email: string; name: string }, transaction: Transaction): Promise<number> {
  return enqueueEmail(welcomeEmail({ to: user.email, name: user.name, confirmUrl: confirmUrlFor(user) }), { transaction });
}

import 'server-only';
import { Op } from 'sequelize';
import { getEnv } from '@/lib/env';
import { db } from '@/models';
import { applyEndedSession } from './webhooks';
import { stripe } from './stripe';

/**
 * For checkouts well past their expiry whose webhook never arrived: asks the payment service for the
 * session and applies what it says (an expired one releases the seat; a paid one is left to its webhook).
 */
export async function releaseStaleCheckouts(now = new Date()): Promise<number> {
  const { Payment } = db();
  const graceMs = (getEnv().CHECKOUT_EXPIRES_MINUTES + 10) * 60_000;
  const stale = await Payment.findAll({ where: { status: 'pending', createdAt: { [Op.lt]: new Date(now.getTime() - graceMs) } }, limit: 50 });
  let released = 0;
  for (const payment of stale) {
    const session = await stripe().checkout.sessions.retrieve(payment.checkoutSessionId);
    if (session.status !== 'expired') continue;
    if (await applyEndedSession(session, `reconcile:${session.id}`)) released += 1;
  }
  return released;
}

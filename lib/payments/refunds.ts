import 'server-only';
import { audit } from '@/lib/audit';
import { enqueueEmail } from '@/lib/email/outbox';
import { refundEmail } from '@/lib/email/templates';
import { transitionEnrollment } from '@/lib/enrollment/state';
import { AppError } from '@/lib/errors';
import { db } from '@/models';
import { stripe } from './stripe';

export type RefundResult = { paymentId: number; refundId: string; amountCents: number; enrollmentStatus: string };

/**
 * Refunds an enrollment's paid fee through the SDK, then (in one transaction) marks the payment
 * refunded, withdraws the enrollment (its seat is released) and queues the refund e-mail.
 * The idempotency key is per payment, so pressing the button twice refunds once.
 */
export async function refundEnrollment({
  enrollmentId,
  actorId,
  reason,
}: {
  enrollmentId: number;
  actorId: number;
  reason?: string | null;
}): Promise<RefundResult> {
  const { Enrollment, Payment, Course, Workshop, User, sequelize } = db();
  const enrollment = await Enrollment.findByPk(enrollmentId);
  if (!enrollment) throw new AppError('not_found', 'That enrollment does not exist.');
  if (enrollment.status === 'completed')
    throw new AppError('conflict', 'This learner has completed the course; a completed enrollment is not refunded from here.');
  const payment = await Payment.findOne({ where: { enrollmentId, status: 'paid' }, order: [['id', 'DESC']] });
  if (!payment) throw new AppError('conflict', 'There is no card payment to refund for this enrollment.');
  if (!payment.paymentIntentId) throw new AppError('conflict', 'This payment has no payment reference to refund against.');

  let refund;
  try {
    refund = await stripe().refunds.create(
      {
        payment_intent: payment.paymentIntentId,
        reason: 'requested_by_customer',
        metadata: { enrollmentId: String(enrollmentId), paymentId: String(payment.id) },
      },
      { idempotencyKey: `brinewright-refund-payment-${payment.id}-${payment.createdAt.getTime()}` },
    );
  } catch (error) {
    const e = error as { type?: string; code?: string; message?: string };
    if (e.type === 'StripeInvalidRequestError') throw new AppError('conflict', `The payment service refused the refund: ${e.message ?? 'unknown reason'}`);
    console.error('[brinewright] refund failed', error);
    throw new AppError('unavailable', 'The payment service cannot be reached right now; nothing was refunded. Please try again in a few minutes.');
  }

  return sequelize.transaction(async (transaction) => {
    const locked = (await Payment.findByPk(payment.id, { transaction, lock: transaction.LOCK.UPDATE }))!;
    const current = (await Enrollment.findByPk(enrollmentId, { transaction, lock: transaction.LOCK.UPDATE }))!;
    if (locked.status === 'refunded') return { paymentId: locked.id, refundId: refund.id, amountCents: locked.refundedCents, enrollmentStatus: current.status };
    await locked.update({ status: 'refunded', refundedCents: refund.amount }, { transaction });
    await audit(
      {
        actorId,
        action: 'payment.refunded',
        subjectType: 'payment',
        subjectId: locked.id,
        data: { refundId: refund.id, amountCents: refund.amount, enrollmentId, reason: reason ?? null },
      },
      { transaction },
    );
    if (current.status === 'active' || current.status === 'awaiting_payment') {
      await transitionEnrollment(current, 'withdrawn', { transaction, actorId, reason: 'refund', data: { paymentId: locked.id, refundId: refund.id } });
    }
    const [course, workshop, learner] = await Promise.all([
      Course.findByPk(current.courseId, { transaction }),
      current.workshopId ? Workshop.findByPk(current.workshopId, { transaction }) : null,
      User.findByPk(current.userId, { transaction }),
    ]);
    await enqueueEmail(
      refundEmail({ to: learner!.email, name: learner!.name, courseTitle: course!.title, workshop, amountCents: refund.amount, currency: locked.currency }),
      { transaction },
    );
    return { paymentId: locked.id, refundId: refund.id, amountCents: refund.amount, enrollmentStatus: current.status };
  });
}

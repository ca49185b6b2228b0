import 'server-only';
import { UniqueConstraintError, type Transaction } from 'sequelize';
import type Stripe from 'stripe';
import { audit } from '@/lib/audit';
import { enqueueEmail } from '@/lib/email/outbox';
import { enrollmentReceiptEmail, paymentMismatchEmail } from '@/lib/email/templates';
import { transitionEnrollment } from '@/lib/enrollment/state';
import { getEnv } from '@/lib/env';
import { AppError } from '@/lib/errors';
import { holdingRoleFor } from '@/lib/users/role-query';
import { db, type Course, type Enrollment, type Payment } from '@/models';
import { stripe } from './stripe';

export type WebhookOutcome = { duplicate: boolean; handled: boolean; type: string };

/** Verifies the signature on the raw body; a missing or wrong one is a 400 and nothing is read. */
export function verifyEvent(rawBody: string, signature: string | null): Stripe.Event {
  if (!signature) throw new AppError('bad_request', 'The Stripe-Signature header is missing.');
  let event: Stripe.Event;
  try {
    event = stripe().webhooks.constructEvent(rawBody, signature, getEnv().STRIPE_WEBHOOK_SECRET);
  } catch {
    throw new AppError('bad_request', 'The webhook signature does not match.');
  }
  // A signed body that is not an event (no id or type, no data.object, or longer than the
  // payment_events columns) is refused before anything is stored.
  const e = event as unknown as { id?: unknown; type?: unknown; data?: { object?: unknown } | null };
  const object = e && typeof e === 'object' && e.data && typeof e.data === 'object' ? e.data.object : undefined;
  if (
    typeof e?.id !== 'string' ||
    !e.id ||
    e.id.length > 255 ||
    typeof e.type !== 'string' ||
    !e.type ||
    e.type.length > 100 ||
    !object ||
    typeof object !== 'object' ||
    Array.isArray(object)
  ) {
    throw new AppError('bad_request', 'The webhook body is not an event: it needs an id, a type and data.object.');
  }
  return event;
}

/**
 * Applies one event. The event id is stored first, in the same transaction as its effects, so a
 * replayed event (or two deliveries at once) changes nothing the second time.
 */
export async function handleEvent(event: Stripe.Event): Promise<WebhookOutcome> {
  const { PaymentEvent, sequelize } = db();
  try {
    return await sequelize.transaction(async (transaction) => {
      const row = await PaymentEvent.create(
        { providerEventId: event.id, type: event.type, payload: event as unknown as Record<string, unknown> },
        { transaction },
      );
      let handled = false;
      if (event.type === 'checkout.session.completed' || event.type === 'checkout.session.async_payment_succeeded') {
        handled = await sessionPaid(event.data.object as Stripe.Checkout.Session, event.id, transaction);
      } else if (event.type === 'checkout.session.expired' || event.type === 'checkout.session.async_payment_failed') {
        handled = await sessionEnded(event.data.object as Stripe.Checkout.Session, event.id, transaction);
      }
      await row.update({ processedAt: new Date() }, { transaction });
      return { duplicate: false, handled, type: event.type };
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) return { duplicate: true, handled: false, type: event.type };
    throw error;
  }
}

/** The payment row of a session, locked; created from the session when the webhook arrives first. */
async function lockPayment(session: Stripe.Checkout.Session, enrollmentId: number, transaction: Transaction): Promise<Payment> {
  const { Payment } = db();
  const found = await Payment.findOne({ where: { checkoutSessionId: session.id }, transaction, lock: transaction.LOCK.UPDATE });
  if (found) return found;
  await Payment.create(
    { enrollmentId, checkoutSessionId: session.id, amountCents: session.amount_total ?? 0, currency: session.currency ?? 'usd', status: 'pending' },
    { transaction },
  );
  return (await Payment.findOne({ where: { checkoutSessionId: session.id }, transaction, lock: transaction.LOCK.UPDATE }))!;
}

function enrollmentIdOf(session: Stripe.Checkout.Session): number | null {
  const raw = session.metadata?.enrollmentId ?? session.client_reference_id;
  const id = Number(raw);
  return Number.isInteger(id) && id > 0 ? id : null;
}

async function sessionPaid(session: Stripe.Checkout.Session, eventId: string, transaction: Transaction): Promise<boolean> {
  if (session.payment_status !== 'paid') return false;
  const { Enrollment, Course, Workshop, User } = db();
  const enrollmentId = enrollmentIdOf(session);
  const enrollment = enrollmentId ? await Enrollment.findByPk(enrollmentId, { transaction, lock: transaction.LOCK.UPDATE }) : null;
  if (!enrollment) {
    console.warn(`[brinewright] paid checkout ${session.id} names no known enrollment`);
    return false;
  }
  const payment = await lockPayment(session, enrollment.id, transaction);
  if (payment.status === 'paid' || payment.status === 'refunded') return false;
  // The amount paid must be the enrollment's fee in its course's currency; anything else activates nothing.
  const course = await Course.findByPk(enrollment.courseId, { transaction });
  const paidCents = session.amount_total ?? -1;
  const paidCurrency = (session.currency ?? '').toLowerCase();
  if (!course || paidCents !== enrollment.feeCents || paidCurrency !== course.currency.toLowerCase()) {
    await amountMismatch({ session, eventId, enrollment, course, paidCents, paidCurrency, paymentId: payment.id, transaction });
    return true;
  }
  const paymentIntent = typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
  await payment.update(
    { status: 'paid', paidAt: new Date(), paymentIntentId: paymentIntent, amountCents: session.amount_total ?? payment.amountCents },
    { transaction },
  );
  await audit(
    {
      actorId: null,
      action: 'payment.paid',
      subjectType: 'payment',
      subjectId: payment.id,
      data: { eventId, enrollmentId: enrollment.id, amountCents: payment.amountCents },
    },
    { transaction },
  );

  if (enrollment.status !== 'awaiting_payment') {
    // Paid for a place that was given up meanwhile (another workshop chosen): the desk refunds it.
    await audit(
      { actorId: null, action: 'payment.needs_refund', subjectType: 'payment', subjectId: payment.id, data: { enrollmentStatus: enrollment.status } },
      { transaction },
    );
    return true;
  }
  await transitionEnrollment(enrollment, 'active', { transaction, actorId: null, reason: 'paid', data: { paymentId: payment.id, eventId } });
  const [workshop, learner] = await Promise.all([
    enrollment.workshopId ? Workshop.findByPk(enrollment.workshopId, { transaction }) : null,
    User.findByPk(enrollment.userId, { transaction }),
  ]);
  await enqueueEmail(
    enrollmentReceiptEmail({
      to: learner!.email,
      name: learner!.name,
      courseTitle: course.title,
      workshop,
      amountCents: payment.amountCents,
      currency: payment.currency,
      waived: false,
      appUrl: getEnv().APP_URL,
    }),
    { transaction },
  );
  return true;
}

/** A paid session whose amount or currency is not the fee: audited, every coordinator told, the enrollment left waiting. */
async function amountMismatch({
  session,
  eventId,
  enrollment,
  course,
  paidCents,
  paidCurrency,
  paymentId,
  transaction,
}: {
  session: Stripe.Checkout.Session;
  eventId: string;
  enrollment: Enrollment;
  course: Course | null;
  paidCents: number;
  paidCurrency: string;
  paymentId: number;
  transaction: Transaction;
}) {
  const { User, Payment } = db();
  const feeCurrency = course?.currency ?? '';
  // The money did arrive: the row says so (what was paid), so the desk can refund it.
  const paymentIntent = typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
  await Payment.update(
    { status: 'paid', paidAt: new Date(), paymentIntentId: paymentIntent, amountCents: Math.max(0, paidCents), currency: paidCurrency.slice(0, 3) || 'usd' },
    { where: { id: paymentId }, transaction },
  );
  await audit(
    {
      actorId: null,
      action: 'payment.amount_mismatch',
      subjectType: 'payment',
      subjectId: paymentId,
      data: { eventId, checkoutSessionId: session.id, enrollmentId: enrollment.id, paidCents, paidCurrency, feeCents: enrollment.feeCents, feeCurrency },
    },
    { transaction },
  );
  const [learner, coordinators] = await Promise.all([
    User.findByPk(enrollment.userId, { transaction }),
    User.findAll({ where: holdingRoleFor(['coordinator']), attributes: ['email', 'name'], transaction }),
  ]);
  for (const to of coordinators) {
    await enqueueEmail(
      paymentMismatchEmail({
        to: to.email,
        name: to.name,
        learnerEmail: learner?.email ?? '(account removed)',
        courseTitle: course?.title ?? 'an unknown course',
        enrollmentId: enrollment.id,
        paidCents: Math.max(0, paidCents),
        paidCurrency: paidCurrency || '?',
        feeCents: enrollment.feeCents,
        feeCurrency,
        appUrl: getEnv().APP_URL,
      }),
      { transaction },
    );
  }
}

/** Applies an expired session found by the worker (its webhook never came); true when something changed. */
export async function applyEndedSession(session: Stripe.Checkout.Session, source: string): Promise<boolean> {
  return db().sequelize.transaction((transaction) => sessionEnded(session, source, transaction));
}

async function sessionEnded(session: Stripe.Checkout.Session, eventId: string, transaction: Transaction): Promise<boolean> {
  const { Enrollment } = db();
  const enrollmentId = enrollmentIdOf(session);
  const enrollment = enrollmentId ? await Enrollment.findByPk(enrollmentId, { transaction, lock: transaction.LOCK.UPDATE }) : null;
  if (!enrollment) return false;
  const payment = await lockPayment(session, enrollment.id, transaction);
  // Out of order (expired after paid) or already refunded: a payment is never undone here.
  if (payment.status !== 'pending') return false;
  await payment.update({ status: 'expired' }, { transaction });
  if (enrollment.status !== 'awaiting_payment') return true;
  // A newer checkout for the same enrollment may still be open; only the last one releases the seat.
  const { Payment } = db();
  const stillOpen = await Payment.count({ where: { enrollmentId: enrollment.id, status: 'pending' }, transaction });
  if (stillOpen > 0) return true;
  await transitionEnrollment(enrollment, 'withdrawn', {
    transaction,
    actorId: null,
    reason: 'checkout-expired',
    data: { checkoutSessionId: session.id, eventId },
  });
  return true;
}

import 'server-only';
import { UniqueConstraintError } from 'sequelize';
import { formatWorkshopDate } from '@/lib/enrollment/format';
import { getEnv } from '@/lib/env';
import { db, type Course, type Enrollment, type Workshop } from '@/models';
import { stripe } from './stripe';

/**
 * The checkout page address for an enrollment awaiting payment: the open session when there is one,
 * otherwise a new session (one per enrollment attempt, with an idempotency key so a retried request
 * never makes two).
 */
export async function createCheckoutForEnrollment({
  enrollment,
  course,
  workshop,
  email,
}: {
  enrollment: Enrollment;
  course: Course;
  workshop: Workshop;
  email: string;
}): Promise<string> {
  const { Payment } = db();
  const env = getEnv();
  const appUrl = env.APP_URL.replace(/\/$/, '');
  const previous = await Payment.findAll({ where: { enrollmentId: enrollment.id }, order: [['id', 'DESC']] });
  const pending = previous.find((p) => p.status === 'pending');
  if (pending) {
    const session = await stripe().checkout.sessions.retrieve(pending.checkoutSessionId);
    if (session.status === 'open' && session.url) return session.url;
    if (session.status === 'complete') return `${appUrl}/checkout/success?session_id=${encodeURIComponent(session.id)}`;
  }
  const metadata = { enrollmentId: String(enrollment.id), workshopId: String(workshop.id), courseSlug: course.slug };
  const session = await stripe().checkout.sessions.create(
    {
      mode: 'payment',
      line_items: [
        {
          quantity: 1,
          price_data: {
            currency: course.currency,
            unit_amount: enrollment.feeCents,
            product_data: { name: `${course.title} — workshop on ${formatWorkshopDate(workshop.startsAt.toISOString(), workshop.timeZone)}` },
          },
        },
      ],
      customer_email: email,
      client_reference_id: String(enrollment.id),
      metadata,
      payment_intent_data: { metadata },
      success_url: `${appUrl}/checkout/success?session_id={CHECKOUT_SESSION_ID}`,
      cancel_url: `${appUrl}/checkout/cancel?enrollment=${enrollment.id}`,
      expires_at: Math.floor(Date.now() / 1000) + env.CHECKOUT_EXPIRES_MINUTES * 60,
    },
    { idempotencyKey: `brinewright-enrollment-${enrollment.id}-${enrollment.createdAt.getTime()}-checkout-${previous.length + 1}` },
  );
  try {
    await Payment.create({
      enrollmentId: enrollment.id,
      checkoutSessionId: session.id,
      amountCents: session.amount_total ?? enrollment.feeCents,
      currency: session.currency ?? course.currency,
      status: 'pending',
    });
  } catch (error) {
    // The webhook got here first and recorded the session already.
    if (!(error instanceof UniqueConstraintError)) throw error;
  }
  if (!session.url) throw new Error(`checkout session ${session.id} has no url`);
  return session.url;
}

/** Closes the open checkout sessions of an enrollment that was given up; failures are only logged. */
export async function expireCheckoutQuietly(enrollmentId: number): Promise<void> {
  const pending = await db().Payment.findAll({ where: { enrollmentId, status: 'pending' } });
  for (const payment of pending) {
    try {
      await stripe().checkout.sessions.expire(payment.checkoutSessionId);
    } catch (error) {
      console.warn(`[brinewright] could not expire checkout ${payment.checkoutSessionId}:`, error instanceof Error ? error.message : error);
    }
  }
}

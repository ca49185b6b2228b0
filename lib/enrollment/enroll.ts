import 'server-only';
import { Op, QueryTypes, type Transaction } from 'sequelize';
import type { SessionUser } from '@/lib/auth/users';
import { enqueueEmail } from '@/lib/email/outbox';
import { enrollmentReceiptEmail } from '@/lib/email/templates';
import { getCourse } from '@/lib/content';
import { getEnv } from '@/lib/env';
import { requireConfirmedAddress } from '@/lib/account/confirmed';
import { AppError } from '@/lib/errors';
import { createCheckoutForEnrollment, expireCheckoutQuietly } from '@/lib/payments/checkout';
import { db, type Course, type Enrollment, type Workshop } from '@/models';
import { auditCreated, transitionEnrollment } from './state';
import { SEAT_HOLDING_STATUSES } from './transitions';
import { checkWaiverCode, redeemWaiver } from './waivers';

export type EnrollResult = { outcome: 'checkout'; enrollmentId: number; url: string } | { outcome: 'active'; enrollmentId: number; url: string };

export class WorkshopFullError extends AppError {
  constructor() {
    super('conflict', 'This workshop is full. Please choose another date.', { extra: { reason: 'full' } });
    this.name = 'WorkshopFullError';
  }
}

/** Seat-holding enrollments of a workshop, counted inside the caller's transaction (after the workshop row is locked). */
async function countHolders(workshopId: number, transaction: Transaction): Promise<number> {
  // Raw SQL: the seat count in the caller's locking transaction, exactly the statement the seat rule is reasoned on.
  const [row] = await db().sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM enrollments WHERE workshopId = :workshopId AND status IN (:statuses)', {
    replacements: { workshopId, statuses: [...SEAT_HOLDING_STATUSES] },
    type: QueryTypes.SELECT,
    transaction,
  });
  return Number(row?.n ?? 0);
}

/**
 * Enrolls a learner in a workshop. The workshop row is locked for the whole transaction and the
 * seat-holding enrollments are counted under that lock, so concurrent requests cannot oversell.
 * With a valid waiver code (or a free course) the enrollment is active at once; otherwise it awaits
 * payment and the answer carries the checkout page's address.
 */
export async function enrollInWorkshop({
  user,
  workshopId,
  waiverCode,
  address,
}: {
  user: SessionUser;
  workshopId: number;
  waiverCode?: string | null;
  address: string;
}): Promise<EnrollResult> {
  const { Workshop, Course, Enrollment, User, sequelize } = db();
  const appUrl = getEnv().APP_URL.replace(/\/$/, '');
  const superseded: number[] = [];
  await requireConfirmedAddress(user.id);

  // A typed code is checked (and counted) before the workshop row is locked, so guessing never holds the lock.
  let waiverId: number | null = null;
  if (waiverCode) {
    const target = await Workshop.findByPk(workshopId, { attributes: ['id', 'courseId'] });
    if (!target) throw new AppError('not_found', 'That workshop does not exist.');
    waiverId = await checkWaiverCode({ code: waiverCode, courseId: target.courseId, userId: user.id, address });
  }

  const step = await sequelize.transaction(async (transaction) => {
    const workshop = await Workshop.findByPk(workshopId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!workshop) throw new AppError('not_found', 'That workshop does not exist.');
    if (workshop.startsAt.getTime() <= Date.now()) throw new AppError('conflict', 'That workshop has already started; choose an upcoming date.');
    const course = (await Course.findByPk(workshop.courseId, { transaction }))!;

    // One place per learner per course: an existing one is reused, finished, or refused.
    const mine = await Enrollment.findAll({
      where: { userId: user.id, courseId: course.id, status: { [Op.in]: ['awaiting_payment', 'active', 'completed'] } },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    for (const e of mine) {
      if (e.status !== 'awaiting_payment') {
        throw new AppError('conflict', e.status === 'completed' ? 'You have already completed this course.' : 'You are already enrolled in this course.', {
          extra: { reason: 'enrolled', enrollmentId: e.id },
        });
      }
      if (e.workshopId === workshop.id && !waiverCode) return { kind: 'resume' as const, enrollment: e, course, workshop };
      // Changing workshop (or switching to a waiver): the unpaid place elsewhere is given up.
      await transitionEnrollment(e, 'withdrawn', { transaction, actorId: user.id, reason: 'replaced', data: { workshopId: e.workshopId } });
      superseded.push(e.id);
    }

    if ((await countHolders(workshop.id, transaction)) >= workshop.seats) throw new WorkshopFullError();

    const waiver = waiverId ? await redeemWaiver({ waiverId, courseId: course.id, transaction }) : null;
    // The fee charged is the one the course page shows: the course file's, not the row's copy.
    const content = getCourse(course.slug);
    if (!content) throw new AppError('conflict', 'This course is no longer offered.');
    const fee = content.feeCents;
    const enrollment = await Enrollment.create(
      {
        userId: user.id,
        courseId: course.id,
        workshopId: workshop.id,
        runKey: String(workshop.id),
        status: 'awaiting_payment',
        feeCents: waiver ? 0 : fee,
        feeWaiverId: waiver?.id ?? null,
        contentVersion: content.version,
      },
      { transaction },
    );
    await auditCreated(enrollment, {
      transaction,
      actorId: user.id,
      data: { workshopId: workshop.id, feeCents: enrollment.feeCents, waiverId: waiver?.id ?? null },
    });

    if (waiver || fee === 0) {
      await transitionEnrollment(enrollment, 'active', {
        transaction,
        actorId: user.id,
        reason: waiver ? 'waiver' : 'free',
        data: waiver ? { waiverCode: waiver.code } : undefined,
      });
      const learner = (await User.findByPk(user.id, { transaction }))!;
      await enqueueEmail(
        enrollmentReceiptEmail({
          to: learner.email,
          name: learner.name,
          courseTitle: course.title,
          workshop,
          amountCents: 0,
          currency: course.currency,
          waived: Boolean(waiver),
          appUrl,
        }),
        { transaction },
      );
      return { kind: 'active' as const, enrollment, course, workshop };
    }
    return { kind: 'checkout' as const, enrollment, course, workshop };
  });

  for (const id of superseded) void expireCheckoutQuietly(id);

  if (step.kind === 'active')
    return { outcome: 'active', enrollmentId: step.enrollment.id, url: `${appUrl}/checkout/success?enrollment=${step.enrollment.id}` };
  const url = await checkoutOrRelease({ enrollment: step.enrollment, course: step.course, workshop: step.workshop, user });
  return { outcome: 'checkout', enrollmentId: step.enrollment.id, url };
}

/** Creates (or reuses) the checkout session; when the payment service cannot be reached, the seat is released. */
async function checkoutOrRelease({
  enrollment,
  course,
  workshop,
  user,
}: {
  enrollment: Enrollment;
  course: Course;
  workshop: Workshop;
  user: SessionUser;
}): Promise<string> {
  try {
    return await createCheckoutForEnrollment({ enrollment, course, workshop, email: user.email });
  } catch (error) {
    console.error('[brinewright] checkout could not be created', error);
    const { sequelize, Payment } = db();
    // Only a fresh enrollment without any session is given up; one with a session waits for its webhook.
    const sessions = await Payment.count({ where: { enrollmentId: enrollment.id } });
    if (sessions === 0) {
      await sequelize
        .transaction((transaction) => transitionEnrollment(enrollment.id, 'withdrawn', { transaction, actorId: user.id, reason: 'checkout-unavailable' }))
        .catch(() => undefined);
      throw new AppError('unavailable', 'Card payments are not available right now, so your seat was not kept. Please try again in a few minutes.');
    }
    throw new AppError(
      'unavailable',
      'Card payments are not available right now. Your seat is held while your checkout is open; please try again in a few minutes.',
    );
  }
}

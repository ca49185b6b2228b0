import 'server-only';
import { Op } from 'sequelize';
import { holdingRoleFor } from '@/lib/users/role-query';
import { db } from '@/models';
import { seatsTaken } from './workshops';

export type EnrollmentStatusView = {
  id: number;
  userId: number;
  status: string;
  courseSlug: string;
  courseTitle: string;
  feeCents: number;
  waived: boolean;
  workshop: { startsAt: string; endsAt: string; timeZone: string; place: string } | null;
  payment: { status: string; amountCents: number; currency: string } | null;
};

/** One enrollment with its course, workshop and latest payment (for the success page). */
export async function fetchEnrollmentStatus({ id }: { id: number }): Promise<EnrollmentStatusView | null> {
  const { Enrollment, Course, Workshop, Payment } = db();
  const e = await Enrollment.findByPk(id);
  if (!e) return null;
  const [course, workshop, payment] = await Promise.all([
    Course.findByPk(e.courseId),
    e.workshopId ? Workshop.findByPk(e.workshopId) : null,
    Payment.findOne({ where: { enrollmentId: e.id }, order: [['id', 'DESC']] }),
  ]);
  return {
    id: e.id,
    userId: e.userId,
    status: e.status,
    courseSlug: course!.slug,
    courseTitle: course!.title,
    feeCents: e.feeCents,
    waived: e.feeWaiverId !== null,
    workshop: workshop
      ? { startsAt: workshop.startsAt.toISOString(), endsAt: workshop.endsAt.toISOString(), timeZone: workshop.timeZone, place: workshop.place }
      : null,
    payment: payment ? { status: payment.status, amountCents: payment.amountCents, currency: payment.currency } : null,
  };
}

/** The enrollment a checkout session belongs to, when it is the given learner's. */
export async function fetchEnrollmentIdForSession({ sessionId, userId }: { sessionId: string; userId: number }): Promise<number | null> {
  const { Payment, Enrollment } = db();
  const payment = await Payment.findOne({ where: { checkoutSessionId: sessionId } });
  if (!payment) return null;
  const e = await Enrollment.findByPk(payment.enrollmentId, { attributes: ['id', 'userId'] });
  return e && e.userId === userId ? e.id : null;
}

export type DeskWorkshopRow = {
  id: number;
  courseId: number;
  courseTitle: string;
  startsAt: string;
  endsAt: string;
  timeZone: string;
  place: string;
  seats: number;
  taken: number;
  instructorId: number | null;
  instructorName: string | null;
  attendanceRequired: boolean;
};

/** Every workshop (upcoming first, then past), for the desk, or only those of one instructor. */
export async function fetchWorkshopsForDesk({ instructorId }: { instructorId?: number } = {}): Promise<DeskWorkshopRow[]> {
  const { Workshop, Course, User } = db();
  const rows = await Workshop.findAll({
    where: instructorId ? { instructorId } : {},
    include: [
      { model: Course, as: 'course', attributes: ['title'] },
      { model: User, as: 'instructor', attributes: ['name'] },
    ],
    order: [['startsAt', 'DESC']],
  });
  const taken = await seatsTaken(rows.map((w) => w.id));
  return rows.map((w) => {
    const x = w as unknown as { course?: { title: string }; instructor?: { name: string } | null };
    return {
      id: w.id,
      courseId: w.courseId,
      courseTitle: x.course?.title ?? '',
      startsAt: w.startsAt.toISOString(),
      endsAt: w.endsAt.toISOString(),
      timeZone: w.timeZone,
      place: w.place,
      seats: w.seats,
      taken: taken.get(w.id) ?? 0,
      instructorId: w.instructorId,
      instructorName: x.instructor?.name ?? null,
      attendanceRequired: Boolean(w.attendanceRequired),
    };
  });
}

export async function fetchCourseOptions(): Promise<{ id: number; title: string; slug: string }[]> {
  const courses = await db().Course.findAll({ order: [['title', 'ASC']], attributes: ['id', 'title', 'slug'] });
  return courses.map((c) => ({ id: c.id, title: c.title, slug: c.slug }));
}

export async function fetchInstructorOptions(): Promise<{ id: number; name: string }[]> {
  const users = await db().User.findAll({
    where: holdingRoleFor(['instructor']),
    order: [['name', 'ASC']],
    attributes: ['id', 'name'],
  });
  return users.map((u) => ({ id: u.id, name: u.name }));
}

export type RosterRow = { enrollmentId: number; learnerName: string; learnerEmail: string; status: string; attendedAt: string | null };

/** Learners holding (or having held) a place in a workshop, for marking attendance. */
export async function fetchRoster({ workshopId }: { workshopId: number }): Promise<RosterRow[]> {
  const { Enrollment, User } = db();
  const rows = await Enrollment.findAll({
    where: { workshopId, status: { [Op.in]: ['active', 'completed'] } },
    include: [{ model: User, as: 'user', attributes: ['name', 'email'] }],
    order: [[{ model: User, as: 'user' }, 'name', 'ASC']],
  });
  return rows.map((e) => {
    const u = (e as unknown as { user: { name: string; email: string } }).user;
    return { enrollmentId: e.id, learnerName: u.name, learnerEmail: u.email, status: e.status, attendedAt: e.attendedAt ? e.attendedAt.toISOString() : null };
  });
}

export type PaymentRow = {
  paymentId: number;
  enrollmentId: number;
  learnerName: string;
  learnerEmail: string;
  courseTitle: string;
  workshopStartsAt: string | null;
  workshopTimeZone: string | null;
  amountCents: number;
  refundedCents: number;
  currency: string;
  status: string;
  enrollmentStatus: string;
  paidAt: string | null;
  createdAt: string;
};

/** Every payment, newest first, with its learner and enrollment, for the desk. */
export async function fetchPaymentsForDesk({ limit = 200 }: { limit?: number } = {}): Promise<PaymentRow[]> {
  const { Payment, Enrollment, User, Course, Workshop } = db();
  const rows = await Payment.findAll({
    include: [
      {
        model: Enrollment,
        as: 'enrollment',
        include: [
          { model: User, as: 'user', attributes: ['name', 'email'] },
          { model: Course, as: 'course', attributes: ['title'] },
          { model: Workshop, as: 'workshop', attributes: ['startsAt', 'timeZone'] },
        ],
      },
    ],
    order: [['id', 'DESC']],
    limit,
  });
  return rows.map((p) => {
    const e = (
      p as unknown as {
        enrollment: {
          id: number;
          status: string;
          user: { name: string; email: string };
          course: { title: string };
          workshop: { startsAt: Date; timeZone: string } | null;
        };
      }
    ).enrollment;
    return {
      paymentId: p.id,
      enrollmentId: e.id,
      learnerName: e.user.name,
      learnerEmail: e.user.email,
      courseTitle: e.course.title,
      workshopStartsAt: e.workshop ? e.workshop.startsAt.toISOString() : null,
      workshopTimeZone: e.workshop?.timeZone ?? null,
      amountCents: p.amountCents,
      refundedCents: p.refundedCents,
      currency: p.currency,
      status: p.status,
      enrollmentStatus: e.status,
      paidAt: p.paidAt ? p.paidAt.toISOString() : null,
      createdAt: p.createdAt.toISOString(),
    };
  });
}

export type WaiverRow = {
  id: number;
  code: string;
  courseTitle: string | null;
  maxUses: number;
  uses: number;
  expiresAt: string;
  note: string | null;
  expired: boolean;
};

export async function fetchWaivers(): Promise<WaiverRow[]> {
  const { FeeWaiver, Course } = db();
  const rows = await FeeWaiver.findAll({ include: [{ model: Course, as: 'course', attributes: ['title'] }], order: [['id', 'DESC']] });
  const now = Date.now();
  return rows.map((w) => ({
    id: w.id,
    code: w.code,
    courseTitle: (w as unknown as { course?: { title: string } | null }).course?.title ?? null,
    maxUses: w.maxUses,
    uses: w.uses,
    expiresAt: w.expiresAt.toISOString(),
    note: w.note ?? null,
    expired: w.expiresAt.getTime() <= now,
  }));
}

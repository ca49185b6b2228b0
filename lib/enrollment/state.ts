import 'server-only';
import type { Transaction } from 'sequelize';
import { audit } from '@/lib/audit';
import { AppError } from '@/lib/errors';
import { ENROLLMENT_STATUSES, type EnrollmentStatus } from '@/lib/enrollment-status';
import { db, type Enrollment } from '@/models';
import { canTransition, withdrawnRunKey } from './transitions';

export { ENROLLMENT_STATUSES, type EnrollmentStatus };
export { TRANSITIONS, SEAT_HOLDING_STATUSES, canTransition, holdsSeat } from './transitions';

export class TransitionError extends AppError {
  constructor(
    readonly from: EnrollmentStatus,
    readonly to: EnrollmentStatus,
  ) {
    super('conflict', `An enrollment that is ${from.replace('_', ' ')} cannot become ${to.replace('_', ' ')}.`, { extra: { from, to } });
    this.name = 'TransitionError';
  }
}

export type TransitionOptions = {
  transaction: Transaction;
  actorId: number | null;
  /** Why, in a word or two: 'paid', 'waiver', 'checkout-expired', 'refund', 'certificate' … */
  reason: string;
  data?: Record<string, unknown>;
};

/**
 * Moves an enrollment to a new status: the only way any code changes enrollments.status.
 * Locks the row, refuses moves the state machine does not allow (TransitionError, a 409), and
 * writes the change to the audit log in the same transaction.
 */
export async function transitionEnrollment(enrollmentOrId: Enrollment | number, to: EnrollmentStatus, options: TransitionOptions): Promise<Enrollment> {
  const { Enrollment } = db();
  const id = typeof enrollmentOrId === 'number' ? enrollmentOrId : enrollmentOrId.id;
  const enrollment = await Enrollment.findByPk(id, { transaction: options.transaction, lock: options.transaction.LOCK.UPDATE });
  if (!enrollment) throw new AppError('not_found', 'That enrollment does not exist.');
  const from = enrollment.status;
  if (!canTransition(from, to)) throw new TransitionError(from, to);
  const changes: Partial<Pick<Enrollment, 'status' | 'completedAt' | 'runKey'>> = { status: to };
  if (to === 'completed') changes.completedAt = new Date();
  if (to === 'withdrawn') changes.runKey = withdrawnRunKey(enrollment.id, enrollment.runKey);
  await enrollment.update(changes, { transaction: options.transaction });
  await audit(
    {
      actorId: options.actorId,
      action: `enrollment.${to}`,
      subjectType: 'enrollment',
      subjectId: enrollment.id,
      data: { from, to, reason: options.reason, ...(options.data ?? {}) },
    },
    { transaction: options.transaction },
  );
  if (typeof enrollmentOrId !== 'number') enrollmentOrId.set(changes, { raw: true });
  return enrollment;
}

/** Records a new enrollment (always awaiting payment) in the audit log; used by enroll(). */
export async function auditCreated(enrollment: Enrollment, options: Omit<TransitionOptions, 'reason'> & { reason?: string }): Promise<void> {
  await audit(
    {
      actorId: options.actorId,
      action: 'enrollment.created',
      subjectType: 'enrollment',
      subjectId: enrollment.id,
      data: { to: enrollment.status, reason: options.reason ?? 'enroll', ...(options.data ?? {}) },
    },
    { transaction: options.transaction },
  );
}

import 'server-only';
import { ENROLLMENT_STATUSES, type EnrollmentStatus } from '@/lib/enrollment-status';

export { ENROLLMENT_STATUSES, type EnrollmentStatus };

/** Statuses that hold a seat in a workshop. */
export const SEAT_HOLDING_STATUSES = ['awaiting_payment', 'active'] as const satisfies readonly EnrollmentStatus[];

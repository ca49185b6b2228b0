import type { EnrollmentStatus } from '@/lib/enrollment-status';

// The one set of moves an enrollment may make. Nothing leaves completed or withdrawn.
export const TRANSITIONS: Readonly<Record<EnrollmentStatus, readonly EnrollmentStatus[]>> = {
  awaiting_payment: ['active', 'withdrawn'],
  active: ['completed', 'withdrawn'],
  completed: [],
  withdrawn: [],
};

/** Statuses that hold a seat in a workshop. */
export const SEAT_HOLDING_STATUSES = ['awaiting_payment', 'active'] as const satisfies readonly EnrollmentStatus[];

export function canTransition(from: EnrollmentStatus, to: EnrollmentStatus): boolean {
  return TRANSITIONS[from].includes(to);
}

export function holdsSeat(status: EnrollmentStatus): boolean {
  return (SEAT_HOLDING_STATUSES as readonly EnrollmentStatus[]).includes(status);
}

/**
 * The runKey a withdrawn enrollment moves to, so the (user, course, runKey) unique index no longer
 * blocks the learner from enrolling in the same workshop again; the workshopId stays for history.
 */
export function withdrawnRunKey(enrollmentId: number, runKey: string): string {
  return `withdrawn:${enrollmentId}:${runKey}`.slice(0, 40);
}

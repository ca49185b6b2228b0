export const ENROLLMENT_STATUSES = ['awaiting_payment', 'active', 'completed', 'withdrawn'] as const;
export type EnrollmentStatus = (typeof ENROLLMENT_STATUSES)[number];

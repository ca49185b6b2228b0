/**
 * Validity of certificates, and the refresher rule.
 *
 * 1. A certificate is valid from its issue date for the course's `validityMonths` (the courses
 *    table, which mirrors the course's front matter), counted in calendar months in UTC; a day that
 *    does not exist in the target month falls back to that month's last day (31 Jan + 1 month =
 *    28 or 29 Feb).
 * 2. It is "valid" until the end of its valid-until instant, "expired" after it, and "revoked" once
 *    the coordinator revokes it, whatever the dates say.
 * 3. Refresher rule: completing the refresher course (`volunteer-refresher`) issues a new certificate
 *    of its own. Its validity is counted from the later of (a) its issue date and (b) the valid-until
 *    date of the learner's latest unrevoked certificate in the same line (the flagship course or an
 *    earlier refresher), provided that certificate has not been expired for more than
 *    `REFRESHER_GRACE_MONTHS`. So a volunteer who refreshes early loses none of the time left, and
 *    one who lets it lapse for long starts again from the day the refresher is issued. The earlier
 *    certificate keeps its own dates; verification shows each certificate as it is.
 * 4. The refresher is offered in the Pantry from `REFRESHER_OFFER_MONTHS` before expiry onwards.
 */
export const REFRESHER_COURSE_SLUG = 'volunteer-refresher';
/** Courses whose certificates the refresher extends. */
export const REFRESHED_COURSE_SLUGS = ['pickling-and-canning', 'volunteer-refresher'] as const;
export const REFRESHER_GRACE_MONTHS = 12;
export const REFRESHER_OFFER_MONTHS = 3;

export type CertificateState = 'valid' | 'expired' | 'revoked';

/** The same instant `months` calendar months later (UTC), clamped to the end of a shorter month. */
export function addMonths(date: Date, months: number): Date {
  const y = date.getUTCFullYear();
  const m = date.getUTCMonth() + months;
  const targetYear = y + Math.floor(m / 12);
  const targetMonth = ((m % 12) + 12) % 12;
  const lastDay = new Date(Date.UTC(targetYear, targetMonth + 1, 0)).getUTCDate();
  const day = Math.min(date.getUTCDate(), lastDay);
  return new Date(Date.UTC(targetYear, targetMonth, day, date.getUTCHours(), date.getUTCMinutes(), date.getUTCSeconds(), date.getUTCMilliseconds()));
}

export function certificateState(cert: { validUntil: Date; revokedAt: Date | null }, now: Date = new Date()): CertificateState {
  if (cert.revokedAt) return 'revoked';
  return now.getTime() > cert.validUntil.getTime() ? 'expired' : 'valid';
}

export type PriorCertificate = { courseSlug: string; validUntil: Date; revokedAt: Date | null };

/**
 * The valid-until date of a new certificate (rules 1 and 3). `prior` are the learner's other
 * certificates; they only matter when the new one is for the refresher course.
 */
export function validUntilFor(input: { courseSlug: string; validityMonths: number; issuedAt: Date; prior?: PriorCertificate[] }): Date {
  const { courseSlug, validityMonths, issuedAt } = input;
  let start = issuedAt;
  if (courseSlug === REFRESHER_COURSE_SLUG) {
    const graceCutoff = addMonths(issuedAt, -REFRESHER_GRACE_MONTHS);
    for (const p of input.prior ?? []) {
      if (p.revokedAt) continue;
      if (!(REFRESHED_COURSE_SLUGS as readonly string[]).includes(p.courseSlug)) continue;
      if (p.validUntil.getTime() < graceCutoff.getTime()) continue;
      if (p.validUntil.getTime() > start.getTime()) start = p.validUntil;
    }
  }
  return addMonths(start, validityMonths);
}

/** True when the Pantry should offer the refresher for this certificate (rule 4). */
export function refresherDue(cert: { courseSlug: string; validUntil: Date; revokedAt: Date | null }, now: Date = new Date()): boolean {
  if (cert.revokedAt) return false;
  if (!(REFRESHED_COURSE_SLUGS as readonly string[]).includes(cert.courseSlug)) return false;
  return now.getTime() >= addMonths(cert.validUntil, -REFRESHER_OFFER_MONTHS).getTime();
}

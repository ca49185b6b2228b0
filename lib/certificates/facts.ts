import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { db } from '@/models';
import type { EnrollmentStatus } from '@/lib/enrollment-status';
import { checkEligibility, type CourseRequirements, type Eligibility, type EnrollmentFacts } from './eligibility';
import { requirementsForCourse } from './requirements';
import { REFRESHED_COURSE_SLUGS, REFRESHER_GRACE_MONTHS, addMonths, type PriorCertificate } from './validity';

export type CertificateRow = { id: number; serial: string; issuedAt: Date; validUntil: Date; revokedAt: Date | null; revokeReason: string | null };

export type EnrollmentRow = {
  id: number;
  userId: number;
  learnerName: string;
  learnerEmail: string;
  learnerConfirmed: boolean;
  courseId: number;
  courseSlug: string;
  courseTitle: string;
  /** The course content version the enrollment began under (its requirements). */
  contentVersion: number;
  validityMonths: number;
  workshopId: number | null;
  workshopStartsAt: Date | null;
  workshopPlace: string | null;
  attendanceRequired: boolean | null;
  status: EnrollmentStatus;
  feeCents: number;
  feeWaiverId: number | null;
  attendedAt: Date | null;
  completedAt: Date | null;
  createdAt: Date;
  certificate: CertificateRow | null;
};

export type EnrollmentStanding = {
  row: EnrollmentRow;
  facts: EnrollmentFacts;
  requirements: CourseRequirements;
  eligibility: Eligibility;
  prior: PriorCertificate[];
};

type Options = { transaction?: Transaction; now?: Date };

const asDate = (v: unknown): Date | null => (v === null || v === undefined ? null : v instanceof Date ? v : new Date(String(v)));

/**
 * Everything eligibility needs for many enrollments, in six queries whatever their number:
 * the enrollments (with learner, course, workshop and certificate), then lesson progress, passed
 * quizzes, approved practicals, paid payments and the learners' other certificates, each one query
 * for the whole set.
 */
export async function loadStandings(enrollmentIds: readonly number[], options: Options = {}): Promise<Map<number, EnrollmentStanding>> {
  const result = new Map<number, EnrollmentStanding>();
  if (enrollmentIds.length === 0) return result;
  const { sequelize } = db();
  // Raw SQL: one query per fact for the whole set of enrollments (the desk's eligibility of hundreds at once), read as flat rows.
  const q = <T extends object>(sql: string, replacements: Record<string, unknown>) =>
    sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction: options.transaction });
  const ids = [...new Set(enrollmentIds)];

  const raw = await q<Record<string, unknown>>(
    `SELECT e.id, e.userId, u.name AS learnerName, u.email AS learnerEmail, u.emailVerifiedAt AS learnerConfirmedAt, e.courseId, c.slug AS courseSlug, c.title AS courseTitle,
            e.contentVersion, c.validityMonths, e.workshopId, w.startsAt AS workshopStartsAt, w.place AS workshopPlace, w.attendanceRequired,
            e.status, e.feeCents, e.feeWaiverId, e.attendedAt, e.completedAt, e.createdAt,
            ce.id AS certId, ce.serial, ce.issuedAt, ce.validUntil, ce.revokedAt, ce.revokeReason
       FROM enrollments e
       JOIN users u ON u.id = e.userId
       JOIN courses c ON c.id = e.courseId
       LEFT JOIN workshops w ON w.id = e.workshopId
       LEFT JOIN certificates ce ON ce.enrollmentId = e.id
      WHERE e.id IN (:ids)`,
    { ids },
  );
  if (raw.length === 0) return result;
  const rows: EnrollmentRow[] = raw.map((r) => ({
    id: Number(r.id),
    userId: Number(r.userId),
    learnerName: String(r.learnerName),
    learnerEmail: String(r.learnerEmail),
    learnerConfirmed: r.learnerConfirmedAt !== null && r.learnerConfirmedAt !== undefined,
    courseId: Number(r.courseId),
    courseSlug: String(r.courseSlug),
    courseTitle: String(r.courseTitle),
    contentVersion: Number(r.contentVersion),
    validityMonths: Number(r.validityMonths),
    workshopId: r.workshopId === null ? null : Number(r.workshopId),
    workshopStartsAt: asDate(r.workshopStartsAt),
    workshopPlace: (r.workshopPlace as string | null) ?? null,
    attendanceRequired: r.attendanceRequired === null || r.attendanceRequired === undefined ? null : Boolean(Number(r.attendanceRequired)),
    status: r.status as EnrollmentStatus,
    feeCents: Number(r.feeCents),
    feeWaiverId: r.feeWaiverId === null ? null : Number(r.feeWaiverId),
    attendedAt: asDate(r.attendedAt),
    completedAt: asDate(r.completedAt),
    createdAt: asDate(r.createdAt)!,
    certificate:
      r.certId === null || r.certId === undefined
        ? null
        : {
            id: Number(r.certId),
            serial: String(r.serial),
            issuedAt: asDate(r.issuedAt)!,
            validUntil: asDate(r.validUntil)!,
            revokedAt: asDate(r.revokedAt),
            revokeReason: (r.revokeReason as string | null) ?? null,
          },
  }));

  const userIds = [...new Set(rows.map((r) => r.userId))];
  const courseIds = [...new Set(rows.map((r) => r.courseId))];
  const foundIds = rows.map((r) => r.id);
  const [progress, quizzes, practicals, payments, certificates] = await Promise.all([
    q<{ userId: number; courseId: number; lessonSlug: string }>(
      'SELECT userId, courseId, lessonSlug FROM lesson_progress WHERE userId IN (:userIds) AND courseId IN (:courseIds)',
      { userIds, courseIds },
    ),
    q<{ userId: number; courseId: number; quizSlug: string }>(
      'SELECT DISTINCT userId, courseId, quizSlug FROM quiz_attempts WHERE passed = 1 AND submittedAt IS NOT NULL AND userId IN (:userIds) AND courseId IN (:courseIds)',
      { userIds, courseIds },
    ),
    q<{ enrollmentId: number }>("SELECT DISTINCT enrollmentId FROM practicals WHERE status = 'approved' AND enrollmentId IN (:foundIds)", { foundIds }),
    q<{ enrollmentId: number }>("SELECT DISTINCT enrollmentId FROM payments WHERE status = 'paid' AND enrollmentId IN (:foundIds)", { foundIds }),
    q<{ enrollmentId: number; userId: number; courseSlug: string; validUntil: Date; revokedAt: Date | null }>(
      `SELECT ce.enrollmentId, ce.userId, c.slug AS courseSlug, ce.validUntil, ce.revokedAt
         FROM certificates ce JOIN enrollments e ON e.id = ce.enrollmentId JOIN courses c ON c.id = e.courseId
        WHERE ce.userId IN (:userIds)`,
      { userIds },
    ),
  ]);

  const key = (userId: number, courseId: number) => `${userId}:${courseId}`;
  const group = (list: { userId: number; courseId: number }[], pick: (item: never) => string) => {
    const map = new Map<string, string[]>();
    for (const item of list) {
      const k = key(Number(item.userId), Number(item.courseId));
      const values = map.get(k) ?? [];
      values.push(pick(item as never));
      map.set(k, values);
    }
    return map;
  };
  const read = group(progress, (p: { lessonSlug: string }) => p.lessonSlug);
  const passed = group(quizzes, (a: { quizSlug: string }) => a.quizSlug);
  const approved = new Set(practicals.map((p) => Number(p.enrollmentId)));
  const paid = new Set(payments.map((p) => Number(p.enrollmentId)));
  const requirementsCache = new Map<string, CourseRequirements>();
  const now = options.now ?? new Date();
  const graceCutoff = addMonths(now, -REFRESHER_GRACE_MONTHS);

  for (const row of rows) {
    const versionKey = `${row.courseSlug}@${row.contentVersion}`;
    let requirements = requirementsCache.get(versionKey);
    if (!requirements) {
      requirements = requirementsForCourse(row.courseSlug, row.contentVersion);
      requirementsCache.set(versionKey, requirements);
    }
    const prior: PriorCertificate[] = certificates
      .filter((c) => Number(c.userId) === row.userId && Number(c.enrollmentId) !== row.id)
      .map((c) => ({ courseSlug: c.courseSlug, validUntil: asDate(c.validUntil)!, revokedAt: asDate(c.revokedAt) }));
    const facts: EnrollmentFacts = {
      status: row.status,
      feeCents: row.feeCents,
      paid: paid.has(row.id),
      waived: row.feeWaiverId !== null,
      lessonsRead: read.get(key(row.userId, row.courseId)) ?? [],
      quizzesPassed: passed.get(key(row.userId, row.courseId)) ?? [],
      practicalApproved: approved.has(row.id),
      workshopId: row.workshopId,
      workshopAttendanceRequired: row.attendanceRequired,
      attended: row.attendedAt !== null,
      emailConfirmed: row.learnerConfirmed,
      hasPriorCertificate: prior.some(
        (p) => !p.revokedAt && (REFRESHED_COURSE_SLUGS as readonly string[]).includes(p.courseSlug) && p.validUntil.getTime() >= graceCutoff.getTime(),
      ),
    };
    result.set(row.id, { row, facts, requirements, eligibility: checkEligibility(requirements, facts), prior });
  }
  return result;
}

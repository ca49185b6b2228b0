import 'server-only';
import { QueryTypes } from 'sequelize';
import { db } from '@/models';
import type { EnrollmentStatus } from '@/lib/enrollment-status';

export type LearnerEnrollment = { id: number; courseSlug: string; courseTitle: string; status: EnrollmentStatus; workshopStartsAt: Date | null };

/** The courses a learner is enrolled in, newest first. */
export async function fetchLearnerEnrollments({ userId }: { userId: number }): Promise<LearnerEnrollment[]> {
  // Raw SQL: a three-table join read as flat rows for the header's list.
  return db().sequelize.query<LearnerEnrollment>(
    `SELECT e.id, c.slug AS courseSlug, c.title AS courseTitle, e.status, w.startsAt AS workshopStartsAt
       FROM enrollments e JOIN courses c ON c.id = e.courseId LEFT JOIN workshops w ON w.id = e.workshopId
      WHERE e.userId = :userId ORDER BY e.createdAt DESC`,
    { replacements: { userId }, type: QueryTypes.SELECT },
  );
}

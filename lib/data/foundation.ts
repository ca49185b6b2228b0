import 'server-only';
import { QueryTypes } from 'sequelize';
import { db } from '@/models';
import type { Role } from '@/lib/roles';
import type { EnrollmentStatus } from '@/lib/enrollment-status';

export type LearnerEnrollment = { id: number; courseSlug: string; courseTitle: string; status: EnrollmentStatus; workshopStartsAt: Date | null };

/** The courses a learner is enrolled in, newest first. */
export async function fetchLearnerEnrollments({ userId }: { userId: number }): Promise<LearnerEnrollment[]> {
  return db().sequelize.query<LearnerEnrollment>(
    `SELECT e.id, c.slug AS courseSlug, c.title AS courseTitle, e.status, w.startsAt AS workshopStartsAt
       FROM enrollments e JOIN courses c ON c.id = e.courseId LEFT JOIN workshops w ON w.id = e.workshopId
      WHERE e.userId = :userId ORDER BY e.createdAt DESC`,
    { replacements: { userId }, type: QueryTypes.SELECT },
  );
}

export type UserRow = { id: number; name: string; email: string; roles: Role[]; createdAt: Date };

export async function fetchUsers({ limit = 200 }: { limit?: number } = {}): Promise<UserRow[]> {
  const users = await db().User.findAll({ attributes: ['id', 'name', 'email', 'roles', 'createdAt'], order: [['name', 'ASC']], limit });
  return users.map((u) => ({ id: u.id, name: u.name, email: u.email, roles: u.roles, createdAt: u.createdAt }));
}

import 'server-only';
import { Op } from 'sequelize';
import { db, type Enrollment } from '@/models';

// The one rule for who may read a course's members-only lessons, take its quizzes and submit its
// practical: a learner with an active (or completed) enrollment in that course.
const READING_STATUSES = ['active', 'completed'] as const;

/** The learner's current enrollment in a course that grants access, or null. */
export async function findActiveEnrollment(userId: number, courseSlug: string): Promise<Enrollment | null> {
  const { Course, Enrollment } = db();
  const course = await Course.findOne({ where: { slug: courseSlug }, attributes: ['id'] });
  if (!course) return null;
  return Enrollment.findOne({
    where: { userId, courseId: course.id, status: { [Op.in]: [...READING_STATUSES] } },
    order: [['createdAt', 'DESC']],
  });
}

export async function isEnrolled(userId: number, courseSlug: string): Promise<boolean> {
  return (await findActiveEnrollment(userId, courseSlug)) !== null;
}

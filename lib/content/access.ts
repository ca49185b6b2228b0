import 'server-only';
import { isEnrolled } from '@/lib/access';
import type { SessionUser } from '@/lib/auth/users';
import { roleAllows } from '@/lib/roles';

/**
 * Who may read a members-only lesson: a learner with an active or completed enrollment in the
 * course (the one rule in lib/access.ts), and staff who teach or run the course (instructors and
 * the roles that imply instructor), who review learners' work against these lessons.
 */
export async function canReadMembersLesson(user: Pick<SessionUser, 'id' | 'role'>, courseSlug: string): Promise<boolean> {
  if (roleAllows(user.role, ['instructor'])) return true;
  return isEnrolled(user.id, courseSlug);
}

import 'server-only';
import { Op } from 'sequelize';
import { audit } from '@/lib/audit';
import { getEnv } from '@/lib/env';
import { db } from '@/models';
import { enqueueEmail } from './outbox';
import { workshopReminderEmail } from './templates';

const DAY_MS = 24 * 60 * 60 * 1000;

/**
 * Queues the day-before reminder for every active enrollment in a workshop that starts within the
 * next 24 hours. Each enrollment is reminded once: the audit row written with the message marks it,
 * under a row lock, so two workers running at once do not both send it.
 */
export async function queueWorkshopReminders(now = new Date()): Promise<number> {
  const { Workshop, Enrollment, Course, User, AuditLog, sequelize } = db();
  const workshops = await Workshop.findAll({ where: { startsAt: { [Op.gt]: now, [Op.lte]: new Date(now.getTime() + DAY_MS) } } });
  let queued = 0;
  for (const workshop of workshops) {
    const enrollments = await Enrollment.findAll({ where: { workshopId: workshop.id, status: 'active' }, attributes: ['id'] });
    for (const { id } of enrollments) {
      const done = await sequelize.transaction(async (transaction) => {
        const enrollment = await Enrollment.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
        if (!enrollment || enrollment.status !== 'active') return false;
        const already = await AuditLog.count({ where: { subjectType: 'enrollment', subjectId: String(id), action: 'workshop.reminder_queued' }, transaction });
        if (already) return false;
        const [course, learner] = await Promise.all([Course.findByPk(enrollment.courseId, { transaction }), User.findByPk(enrollment.userId, { transaction })]);
        await enqueueEmail(workshopReminderEmail({ to: learner!.email, name: learner!.name, courseTitle: course!.title, workshop, appUrl: getEnv().APP_URL }), {
          transaction,
        });
        await audit(
          { actorId: null, action: 'workshop.reminder_queued', subjectType: 'enrollment', subjectId: id, data: { workshopId: workshop.id } },
          { transaction },
        );
        return true;
      });
      if (done) queued += 1;
    }
  }
  return queued;
}

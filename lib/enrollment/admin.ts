import 'server-only';
import type { SessionUser } from '@/lib/auth/users';
import { audit } from '@/lib/audit';
import { AppError } from '@/lib/errors';
import { roleAllows } from '@/lib/roles';
import type { WorkshopValues } from '@/lib/validations/workshop';
import { db } from '@/models';
import { zonedToUtc } from './time';
import { seatsTaken } from './workshops';

const fieldError = (field: string, message: string) => new AppError('bad_request', message, { fields: { [field]: [message] } });

/** Creates (no id) or edits a workshop from the coordinator's form; times are entered in the workshop's zone. */
export async function saveWorkshop({ id, values, actorId }: { id?: number; values: WorkshopValues; actorId: number }): Promise<number> {
  const { Workshop, Course, User, sequelize } = db();
  const startsAt = zonedToUtc(values.date, values.startTime, values.timeZone);
  const endsAt = zonedToUtc(values.date, values.endTime, values.timeZone);
  if (!(await Course.findByPk(values.courseId))) throw fieldError('courseId', 'Choose a course.');
  if (values.instructorId !== null) {
    const instructor = await User.findByPk(values.instructorId);
    if (!instructor || !roleAllows(instructor.roles, ['instructor'])) throw fieldError('instructorId', 'Choose someone with the instructor role.');
  }
  return sequelize.transaction(async (transaction) => {
    const fields = {
      courseId: values.courseId,
      instructorId: values.instructorId,
      startsAt,
      endsAt,
      timeZone: values.timeZone,
      place: values.place,
      seats: values.seats,
      attendanceRequired: values.attendanceRequired,
    };
    if (!id) {
      if (startsAt.getTime() <= Date.now()) throw fieldError('date', 'A new workshop must start in the future.');
      const created = await Workshop.create(fields, { transaction });
      await audit({ actorId, action: 'workshop.created', subjectType: 'workshop', subjectId: created.id, data: { ...fields } }, { transaction });
      return created.id;
    }
    const workshop = await Workshop.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!workshop) throw new AppError('not_found', 'That workshop does not exist.');
    const taken = (await seatsTaken([id], transaction)).get(id) ?? 0;
    if (values.seats < taken) throw fieldError('seats', `${taken} seats are already taken; the workshop cannot have fewer.`);
    if (taken > 0 && values.courseId !== workshop.courseId) throw fieldError('courseId', 'Learners are enrolled; the course of this workshop cannot change.');
    const before = { startsAt: workshop.startsAt, place: workshop.place, seats: workshop.seats, instructorId: workshop.instructorId };
    await workshop.update(fields, { transaction });
    await audit({ actorId, action: 'workshop.updated', subjectType: 'workshop', subjectId: id, data: { before, after: fields } }, { transaction });
    return id;
  });
}

/** An instructor marks (or clears) a learner's attendance; only the workshop's own instructor, or a coordinator. */
export async function markAttendance({ enrollmentId, attended, actor }: { enrollmentId: number; attended: boolean; actor: SessionUser }): Promise<Date | null> {
  const { Enrollment, Workshop, sequelize } = db();
  return sequelize.transaction(async (transaction) => {
    const enrollment = await Enrollment.findByPk(enrollmentId, { transaction, lock: transaction.LOCK.UPDATE });
    const workshop = enrollment?.workshopId ? await Workshop.findByPk(enrollment.workshopId, { transaction }) : null;
    if (!enrollment || !workshop) throw new AppError('not_found', 'That enrollment is not in a workshop.');
    if (workshop.instructorId !== actor.id && !roleAllows(actor.roles, ['coordinator']))
      throw new AppError('forbidden', 'Only the workshop’s instructor or a coordinator marks attendance.');
    if (enrollment.status !== 'active' && enrollment.status !== 'completed') throw new AppError('conflict', 'Attendance is kept only for enrolled learners.');
    if (attended && workshop.startsAt.getTime() > Date.now() + 12 * 3600_000)
      throw new AppError('conflict', 'Attendance can be marked from the day of the workshop.');
    const attendedAt = attended ? (enrollment.attendedAt ?? new Date()) : null;
    await enrollment.update({ attendedAt }, { transaction });
    await audit(
      {
        actorId: actor.id,
        action: attended ? 'enrollment.attended' : 'enrollment.attendance_cleared',
        subjectType: 'enrollment',
        subjectId: enrollment.id,
        data: { workshopId: workshop.id },
      },
      { transaction },
    );
    return attendedAt;
  });
}

import 'server-only';
import { Op, QueryTypes, type Transaction } from 'sequelize';
import { db } from '@/models';
import { SEAT_HOLDING_STATUSES } from './transitions';

export type PublicWorkshop = {
  id: number;
  courseSlug: string;
  startsAt: string;
  endsAt: string;
  timeZone: string;
  place: string;
  seats: number;
  seatsLeft: number;
  instructorName: string | null;
  attendanceRequired: boolean;
  /** The signed-in learner's own enrollment in this workshop, when there is one. */
  myStatus: string | null;
};

/** Seats taken per workshop: enrollments that hold a seat (awaiting payment or active). */
export async function seatsTaken(workshopIds: number[], transaction?: Transaction): Promise<Map<number, number>> {
  const taken = new Map<number, number>();
  if (!workshopIds.length) return taken;
  // Raw SQL: a grouped COUNT per workshop in one statement, read as plain numbers.
  const rows = await db().sequelize.query<{ workshopId: number; n: number }>(
    `SELECT workshopId, COUNT(*) AS n FROM enrollments WHERE workshopId IN (:ids) AND status IN (:statuses) GROUP BY workshopId`,
    { replacements: { ids: workshopIds, statuses: [...SEAT_HOLDING_STATUSES] }, type: QueryTypes.SELECT, transaction },
  );
  for (const row of rows) taken.set(Number(row.workshopId), Number(row.n));
  return taken;
}

/** Upcoming workshops of a course (those that have not started), soonest first; null when the course is unknown. */
export async function fetchUpcomingWorkshops({
  courseSlug,
  userId,
  now = new Date(),
}: {
  courseSlug: string;
  userId?: number | null;
  now?: Date;
}): Promise<PublicWorkshop[] | null> {
  const { Course, Workshop, User, Enrollment } = db();
  const course = await Course.findOne({ where: { slug: courseSlug }, attributes: ['id', 'slug'] });
  if (!course) return null;
  const workshops = await Workshop.findAll({
    where: { courseId: course.id, startsAt: { [Op.gt]: now } },
    include: [{ model: User, as: 'instructor', attributes: ['name'] }],
    order: [['startsAt', 'ASC']],
  });
  const ids = workshops.map((w) => w.id);
  const taken = await seatsTaken(ids);
  const mine = new Map<number, string>();
  if (userId && ids.length) {
    const own = await Enrollment.findAll({
      where: { userId, workshopId: { [Op.in]: ids } },
      attributes: ['workshopId', 'status'],
      order: [['updatedAt', 'ASC']],
    });
    for (const e of own) if (e.workshopId) mine.set(e.workshopId, e.status);
  }
  return workshops.map((w) => {
    const instructor = (w as unknown as { instructor?: { name: string } | null }).instructor;
    return {
      id: w.id,
      courseSlug: course.slug,
      startsAt: w.startsAt.toISOString(),
      endsAt: w.endsAt.toISOString(),
      timeZone: w.timeZone,
      place: w.place,
      seats: w.seats,
      seatsLeft: Math.max(0, w.seats - (taken.get(w.id) ?? 0)),
      instructorName: instructor?.name ?? null,
      attendanceRequired: Boolean(w.attendanceRequired),
      myStatus: mine.get(w.id) ?? null,
    };
  });
}

import { beforeEach, describe, expect, it } from 'vitest';
import { POST as attendancePOST } from '@/app/api/enrollments/[id]/attendance/route';
import { GET as enrollmentGET } from '@/app/api/enrollments/[id]/route';
import { GET as workshopsGET } from '@/app/api/courses/[course]/workshops/route';
import { GET as waiversGET, POST as waiversPOST } from '@/app/api/waivers/route';
import { saveWorkshop } from '@/lib/enrollment/admin';
import { TransitionError, transitionEnrollment } from '@/lib/enrollment/state';
import { db } from '@/models';
import { createCourses, createUser, resetDatabase } from '../support/db';
import { jsonRequest, params } from '../support/request';
import { actAs } from '../support/session';

let courseId: number;

beforeEach(async () => {
  await resetDatabase();
  actAs(null);
  courseId = (await createCourses()).flagship.id;
});

async function workshop(overrides: Partial<{ hoursFromNow: number; seats: number; instructorId: number | null }> = {}) {
  const startsAt = new Date(Date.now() + (overrides.hoursFromNow ?? 240) * 3600_000);
  return db().Workshop.create({
    courseId,
    instructorId: overrides.instructorId ?? null,
    startsAt,
    endsAt: new Date(startsAt.getTime() + 5 * 3600_000),
    timeZone: 'America/Denver',
    place: 'Grange Hall',
    seats: overrides.seats ?? 12,
  });
}

async function enrollment(userId: number, workshopId: number, status: 'awaiting_payment' | 'active' = 'active') {
  return db().Enrollment.create({ userId, courseId, workshopId, runKey: String(workshopId), status, feeCents: 4500 });
}

describe('the enrollment state machine', () => {
  it('moves only along allowed edges and writes each move to the audit log in the same transaction', async () => {
    const learner = await createUser('learner');
    const w = await workshop();
    const e = await enrollment(learner.id, w.id, 'awaiting_payment');
    const { sequelize, AuditLog, Enrollment } = db();
    await sequelize.transaction((transaction) => transitionEnrollment(e, 'active', { transaction, actorId: null, reason: 'paid' }));
    await sequelize.transaction((transaction) => transitionEnrollment(e.id, 'completed', { transaction, actorId: learner.id, reason: 'certificate' }));
    const done = (await Enrollment.findByPk(e.id))!;
    expect(done.status).toBe('completed');
    expect(done.completedAt).toBeInstanceOf(Date);
    await expect(
      sequelize.transaction((transaction) => transitionEnrollment(e.id, 'withdrawn', { transaction, actorId: null, reason: 'x' })),
    ).rejects.toBeInstanceOf(TransitionError);
    await expect(sequelize.transaction((transaction) => transitionEnrollment(e.id, 'active', { transaction, actorId: null, reason: 'x' }))).rejects.toThrow(
      /completed cannot become active/,
    );
    const audit = await AuditLog.findAll({ where: { subjectType: 'enrollment', subjectId: String(e.id) }, order: [['id', 'ASC']] });
    expect(audit.map((a) => [a.action, (a.data as { from: string }).from])).toEqual([
      ['enrollment.active', 'awaiting_payment'],
      ['enrollment.completed', 'active'],
    ]);

    // A move rolled back with its transaction leaves no audit row behind.
    const other = await enrollment((await createUser('learner')).id, w.id, 'awaiting_payment');
    await expect(
      sequelize.transaction(async (transaction) => {
        await transitionEnrollment(other, 'withdrawn', { transaction, actorId: null, reason: 'test' });
        throw new Error('rolled back');
      }),
    ).rejects.toThrow('rolled back');
    expect((await Enrollment.findByPk(other.id))!.status).toBe('awaiting_payment');
    expect(await AuditLog.count({ where: { subjectId: String(other.id), subjectType: 'enrollment' } })).toBe(0);
  });
});

describe('GET /api/courses/[course]/workshops', () => {
  it('lists upcoming workshops soonest first with seats left, instructor and the learner’s own status', async () => {
    const instructor = await createUser('instructor', { name: 'Tomas Instructor' });
    const far = await workshop({ hoursFromNow: 500, seats: 3, instructorId: instructor.id });
    const near = await workshop({ hoursFromNow: 100, seats: 2 });
    await workshop({ hoursFromNow: -48 });
    const [a, b] = await Promise.all([createUser('learner'), createUser('learner')]);
    await enrollment(a.id, near.id, 'active');
    await enrollment(b.id, near.id, 'awaiting_payment');
    await db().Enrollment.create({
      userId: (await createUser('learner')).id,
      courseId,
      workshopId: far.id,
      runKey: `withdrawn:9:${far.id}`,
      status: 'withdrawn',
      feeCents: 4500,
    });

    actAs(a);
    const response = await workshopsGET(
      new Request('http://localhost:3000/api/courses/pickling-and-canning/workshops'),
      params({ course: 'pickling-and-canning' }),
    );
    expect(response.status).toBe(200);
    const { workshops } = await response.json();
    expect(workshops.map((w: { id: number }) => w.id)).toEqual([near.id, far.id]);
    expect(workshops[0]).toMatchObject({ seats: 2, seatsLeft: 0, myStatus: 'active', timeZone: 'America/Denver', instructorName: null });
    expect(workshops[1]).toMatchObject({ seats: 3, seatsLeft: 3, myStatus: null, instructorName: 'Tomas Instructor' });

    const missing = await workshopsGET(new Request('http://localhost:3000/api/courses/nope/workshops'), params({ course: 'nope' }));
    expect(missing.status).toBe(404);
  });

  it('GET /api/enrollments/[id] answers the owner and the coordinator, and 404 to anyone else', async () => {
    const w = await workshop();
    const owner = await createUser('learner');
    const e = await enrollment(owner.id, w.id, 'awaiting_payment');
    const get = () => enrollmentGET(new Request(`http://localhost:3000/api/enrollments/${e.id}`), params({ id: String(e.id) }));
    actAs(owner);
    expect((await (await get()).json()).enrollment).toMatchObject({ id: e.id, status: 'awaiting_payment', courseSlug: 'pickling-and-canning' });
    actAs(await createUser('learner'));
    expect((await get()).status).toBe(404);
    actAs(await createUser('coordinator'));
    expect((await get()).status).toBe(200);
    actAs(null);
    expect((await get()).status).toBe(401);
  });
});

describe('workshops at the desk', () => {
  it('stores the wall-clock time of the place as UTC and refuses fewer seats than are taken', async () => {
    const coordinator = await createUser('coordinator');
    const instructor = await createUser('instructor');
    const year = new Date().getUTCFullYear() + 1;
    // America/Denver keeps MST (UTC−7) in December (IANA tz database).
    const id = await saveWorkshop({
      values: {
        courseId,
        date: `${year}-12-12`,
        startTime: '09:00',
        endTime: '14:30',
        timeZone: 'America/Denver',
        place: 'Grange Hall',
        seats: 2,
        instructorId: instructor.id,
        attendanceRequired: true,
      },
      actorId: coordinator.id,
    });
    const saved = (await db().Workshop.findByPk(id))!;
    expect(saved.startsAt.toISOString()).toBe(`${year}-12-12T16:00:00.000Z`);
    expect(saved.endsAt.toISOString()).toBe(`${year}-12-12T21:30:00.000Z`);
    expect(await db().AuditLog.count({ where: { action: 'workshop.created', subjectId: String(id) } })).toBe(1);

    await enrollment((await createUser('learner')).id, id);
    await enrollment((await createUser('learner')).id, id, 'awaiting_payment');
    const values = {
      courseId,
      date: `${year}-12-12`,
      startTime: '09:00',
      endTime: '14:30',
      timeZone: 'America/Denver',
      place: 'Grange Hall',
      seats: 1,
      instructorId: instructor.id,
      attendanceRequired: true,
    };
    await expect(saveWorkshop({ id, values, actorId: coordinator.id })).rejects.toMatchObject({
      fields: { seats: ['2 seats are already taken; the workshop cannot have fewer.'] },
    });
    await expect(saveWorkshop({ values: { ...values, instructorId: (await createUser('learner')).id }, actorId: coordinator.id })).rejects.toMatchObject({
      fields: { instructorId: expect.any(Array) },
    });
    await expect(saveWorkshop({ values: { ...values, date: '2020-01-01' }, actorId: coordinator.id })).rejects.toMatchObject({
      fields: { date: expect.any(Array) },
    });
    await saveWorkshop({ id, values: { ...values, seats: 5, place: 'Community Kitchen' }, actorId: coordinator.id });
    expect((await db().Workshop.findByPk(id))!.place).toBe('Community Kitchen');
  });

  it('attendance: the workshop’s instructor marks it on the day; another instructor and learners may not', async () => {
    const mine = await createUser('instructor');
    const otherInstructor = await createUser('instructor');
    const today = await workshop({ hoursFromNow: 2, instructorId: mine.id });
    const nextMonth = await workshop({ hoursFromNow: 720, instructorId: mine.id });
    const learner = await createUser('learner');
    const e = await enrollment(learner.id, today.id);
    const post = (id: number, attended: boolean) => attendancePOST(jsonRequest(`/api/enrollments/${id}/attendance`, { attended }), params({ id: String(id) }));

    actAs(learner);
    expect((await post(e.id, true)).status).toBe(403);
    actAs(otherInstructor);
    expect((await post(e.id, true)).status).toBe(403);
    actAs(mine);
    const ok = await post(e.id, true);
    expect(ok.status).toBe(200);
    expect((await db().Enrollment.findByPk(e.id))!.attendedAt).toBeInstanceOf(Date);
    expect((await post(e.id, false)).status).toBe(200);
    expect((await db().Enrollment.findByPk(e.id))!.attendedAt).toBeNull();
    const early = await enrollment((await createUser('learner')).id, nextMonth.id);
    expect((await post(early.id, true)).status).toBe(409);
    actAs(await createUser('coordinator'));
    expect((await post(e.id, true)).status).toBe(200);
    expect(await db().AuditLog.count({ where: { action: 'enrollment.attended' } })).toBe(2);
  });
});

describe('fee waivers at the desk', () => {
  it('coordinators create codes (given or generated); duplicates and bad input are refused; others may not', async () => {
    const year = new Date().getUTCFullYear() + 1;
    actAs(await createUser('learner'));
    expect((await waiversPOST(jsonRequest('/api/waivers', { maxUses: 3, expiresOn: `${year}-01-31`, courseId: '' }), {})).status).toBe(403);
    actAs(await createUser('coordinator'));
    const given = await waiversPOST(
      jsonRequest('/api/waivers', { code: 'grange-2027', maxUses: 3, expiresOn: `${year}-01-31`, courseId: String(courseId), note: 'Grange volunteers' }),
      {},
    );
    expect(given.status).toBe(201);
    expect((await given.json()).waiver).toMatchObject({ code: 'GRANGE-2027', maxUses: 3, uses: 0, expiresAt: `${year}-01-31T23:59:59.000Z` });
    const generated = await waiversPOST(jsonRequest('/api/waivers', { code: '', maxUses: 1, expiresOn: `${year}-01-31`, courseId: '' }), {});
    expect((await generated.json()).waiver.code).toMatch(/^BRINE-(?:[A-HJKMNP-Z2-9]{4}-){2}[A-HJKMNP-Z2-9]{4}$/);
    expect((await waiversPOST(jsonRequest('/api/waivers', { code: 'GRANGE-2027', maxUses: 3, expiresOn: `${year}-01-31`, courseId: '' }), {})).status).toBe(
      409,
    );
    const bad = await waiversPOST(jsonRequest('/api/waivers', { code: 'x', maxUses: 0, expiresOn: 'soon', courseId: '' }), {});
    expect(bad.status).toBe(400);
    expect(Object.keys((await bad.json()).fields).sort()).toEqual(['code', 'expiresOn', 'maxUses']);
    expect((await waiversPOST(jsonRequest('/api/waivers', { maxUses: 1, expiresOn: '2020-01-01', courseId: '' }), {})).status).toBe(400);
    const list = await (await waiversGET(new Request('http://localhost:3000/api/waivers'), {})).json();
    expect(list.waivers).toHaveLength(2);
  });
});

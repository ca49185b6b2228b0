import { beforeAll, describe, expect, it } from 'vitest';
import { GET as pantry } from '@/app/api/pantry/route';
import { GET as submissions } from '@/app/api/tasting-table/submissions/route';
import { requireRole } from '@/lib/auth/guard';
import { ROLES, type Role } from '@/lib/roles';
import { db } from '@/models';
import { createCourses, createUser, resetDatabase } from '../support/db';
import { actAs } from '../support/session';

// Every non-empty set of the four roles (15), against every check the guard makes in app/: the
// learner's pages, the instructor's, the coordinator's, the admin's, and "any signed-in user".
const SETS: Role[][] = [];
for (let mask = 1; mask < 1 << ROLES.length; mask += 1) SETS.push(ROLES.filter((_, i) => mask & (1 << i)));

// The rule written out as DESIGN.md states it, apart from lib/roles.ts: admin ⊃ coordinator ⊃ instructor; learner apart.
const passes = (set: Role[], allowed: Role | 'anyone'): boolean => {
  if (allowed === 'anyone') return true;
  const senior: Record<Role, Role[]> = {
    learner: ['learner'],
    instructor: ['instructor', 'coordinator', 'admin'],
    coordinator: ['coordinator', 'admin'],
    admin: ['admin'],
  };
  return senior[allowed].some((r) => set.includes(r));
};

describe('the guard with sets of roles', () => {
  const people = new Map<string, Awaited<ReturnType<typeof createUser>>>();

  beforeAll(async () => {
    await resetDatabase();
    await createCourses();
    for (const set of SETS) people.set(set.join('+'), await createUser(set));
  });

  it('makes 15 sets', () => expect(SETS).toHaveLength(15));

  for (const set of SETS) {
    it(`${set.join(' + ')}: passes exactly where one of its roles allows`, async () => {
      const user = people.get(set.join('+'))!;
      actAs(user);
      const got: Record<string, number> = {};
      const wanted: Record<string, number> = {};
      for (const allowed of [...ROLES, 'anyone'] as const) {
        const answer = await requireRole(...(allowed === 'anyone' ? [] : [allowed])).then(
          (u) => (u.id === user.id ? 200 : 500),
          (error: { status?: number }) => error.status ?? 500,
        );
        got[allowed] = answer;
        wanted[allowed] = passes(set, allowed) ? 200 : 403;
      }
      expect(got).toEqual(wanted);
      // The roles the guard reports are the account's, in one order.
      await expect(requireRole()).resolves.toMatchObject({ roles: set });
    });
  }

  it('signs nobody in without a session: 401 for every check', async () => {
    actAs(null);
    for (const allowed of ROLES) await expect(requireRole(allowed)).rejects.toMatchObject({ status: 401 });
  });

  it('an instructor who is also a learner opens both the Pantry and the Tasting table; an instructor alone only the table', async () => {
    const get = (handler: (r: Request) => Promise<Response>, path: string) => handler(new Request(`http://localhost${path}`));
    actAs(people.get('learner+instructor')!);
    expect((await get(pantry as never, '/api/pantry')).status).toBe(200);
    expect((await get(submissions as never, '/api/tasting-table/submissions')).status).toBe(200);
    actAs(people.get('instructor')!);
    expect((await get(pantry as never, '/api/pantry')).status).toBe(403);
    expect((await get(submissions as never, '/api/tasting-table/submissions')).status).toBe(200);
  });

  it('reads the roles from the database on each request: a set changed under a session applies at once', async () => {
    const user = people.get('learner+instructor')!;
    actAs(user);
    await db().User.update({ roles: ['learner'] }, { where: { id: user.id } });
    await expect(requireRole('instructor')).rejects.toMatchObject({ status: 403 });
    await db().User.update({ roles: ['learner', 'instructor'] }, { where: { id: user.id } });
    await expect(requireRole('instructor')).resolves.toMatchObject({ roles: ['learner', 'instructor'] });
  });
});

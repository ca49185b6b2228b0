import { beforeEach, describe, expect, it } from 'vitest';
import { POST as deactivate } from '@/app/api/admin/users/[id]/deactivate/route';
import { POST as reactivate } from '@/app/api/admin/users/[id]/reactivate/route';
import { POST as setRoles } from '@/app/api/admin/users/[id]/roles/route';
import { requireRole } from '@/lib/auth/guard';
import { verifyCredentials } from '@/lib/auth/users';
import { fetchUsersPage } from '@/lib/users/directory';
import { db } from '@/models';
import { createCourses, createUser, resetDatabase } from '../support/db';
import { jsonRequest, params } from '../support/request';
import { actAs } from '../support/session';

const post = (handler: typeof deactivate, id: number | string, body?: unknown) =>
  handler(jsonRequest(`/api/admin/users/${id}`, body ?? ''), params({ id: String(id) }));

describe('the admin’s user list', () => {
  beforeEach(resetDatabase);

  it('finds accounts by part of the name or the e-mail, in any case, and pages through them', async () => {
    await createUser('learner', { name: 'Marta Quince', email: 'marta@orchard.example' });
    await createUser('learner', { name: 'Quentin Ash', email: 'q.ash@valley.example' });
    await createUser('instructor', { name: 'Rosa Delgado', email: 'rosa@quince-farm.example' });
    await createUser('learner', { name: 'Percy 100% Pickles', email: 'percy@valley.example' });
    const byName = await fetchUsersPage({ q: 'QUINCE', page: 1 });
    expect(byName.users.map((u) => u.name)).toEqual(['Marta Quince', 'Rosa Delgado']);
    expect(byName.total).toBe(2);
    expect((await fetchUsersPage({ q: 'valley.example', page: 1 })).users.map((u) => u.name)).toEqual(['Percy 100% Pickles', 'Quentin Ash']);
    // % and _ are searched for as typed, not as wildcards.
    expect((await fetchUsersPage({ q: '100%', page: 1 })).users.map((u) => u.name)).toEqual(['Percy 100% Pickles']);
    expect((await fetchUsersPage({ q: '_', page: 1 })).total).toBe(0);
    // Pages of two, by name; a page past the end shows the last one.
    const first = await fetchUsersPage({ q: '', page: 1 }, 2);
    expect({ total: first.total, pages: first.pages, names: first.users.map((u) => u.name) }).toEqual({
      total: 4,
      pages: 2,
      names: ['Marta Quince', 'Percy 100% Pickles'],
    });
    const second = await fetchUsersPage({ q: '', page: 9 }, 2);
    expect({ page: second.page, names: second.users.map((u) => u.name) }).toEqual({ page: 2, names: ['Quentin Ash', 'Rosa Delgado'] });
  });

  it('lists more than 200 accounts, page by page', async () => {
    const { User } = db();
    await User.bulkCreate(
      Array.from({ length: 230 }, (_, i) => ({ email: `bulk${i}@test.example`, name: `Bulk ${String(i).padStart(3, '0')}`, passwordHash: 'x' })),
    );
    const last = await fetchUsersPage({ q: '', page: 10 });
    expect({ total: last.total, pages: last.pages, page: last.page, count: last.users.length }).toEqual({ total: 230, pages: 10, page: 10, count: 5 });
    expect(last.users.at(-1)?.name).toBe('Bulk 229');
  });
});

describe('role sets at /api/admin/users/:id/roles', () => {
  beforeEach(resetDatabase);

  it('replaces the set for an admin, and refuses everyone else, bad sets and removing one’s own admin role', async () => {
    const admin = await createUser('admin');
    const target = await createUser('learner');
    for (const who of [null, await createUser('coordinator'), await createUser(['learner', 'instructor'])]) {
      actAs(who);
      expect((await post(setRoles, target.id, { roles: ['admin'] })).status).toBe(who ? 403 : 401);
    }
    actAs(admin);
    for (const body of [{}, { roles: [] }, { roles: ['superuser'] }, { roles: 'admin' }]) expect((await post(setRoles, target.id, body)).status).toBe(400);
    expect((await post(setRoles, 'abc', { roles: ['learner'] })).status).toBe(400);
    expect((await post(setRoles, 999_999, { roles: ['learner'] })).status).toBe(404);
    const answer = await post(setRoles, target.id, { roles: ['instructor', 'learner', 'instructor'] });
    expect(answer.status).toBe(200);
    expect(await answer.json()).toEqual({ user: { id: target.id, roles: ['learner', 'instructor'] } });
    expect((await db().User.findByPk(target.id))?.roles).toEqual(['learner', 'instructor']);
    expect((await post(setRoles, admin.id, { roles: ['coordinator'] })).status).toBe(409);
    expect((await db().User.findByPk(admin.id))?.roles).toEqual(['admin']);
  });
});

describe('deactivation', () => {
  beforeEach(resetDatabase);

  it('ends the sessions and the sign-in of the account and keeps its records; reactivation lets it sign in again', async () => {
    const admin = await createUser('admin');
    const learner = await createUser('learner');
    const { flagship } = await createCourses();
    const enrollment = await db().Enrollment.create({ userId: learner.id, courseId: flagship.id, runKey: 'self-paced', status: 'active', feeCents: 4500 });
    actAs(learner);
    await expect(requireRole('learner')).resolves.toMatchObject({ id: learner.id });

    actAs(admin);
    const answer = await post(deactivate, learner.id);
    expect(answer.status).toBe(200);
    expect((await answer.json()).user.deactivatedAt).toEqual(expect.any(String));
    // The learner's session, made before, is refused; so is the password.
    actAs(learner);
    await expect(requireRole('learner')).rejects.toMatchObject({ status: 401 });
    expect(await verifyCredentials(learner.email, 'test-password-123', 'deactivation-test')).toBeNull();
    // The records stay: the account row, the enrollment, and the audit entry naming who did it.
    expect(await db().User.count({ where: { id: learner.id } })).toBe(1);
    expect(await db().Enrollment.count({ where: { id: enrollment.id } })).toBe(1);
    const entries = await db().AuditLog.findAll({ where: { action: 'user.deactivated', subjectId: String(learner.id) } });
    expect(entries.map((e) => e.actorId)).toEqual([admin.id]);

    // Twice is once; an admin never deactivates themselves; nobody else may.
    actAs(admin);
    expect((await post(deactivate, learner.id)).status).toBe(200);
    expect(await db().AuditLog.count({ where: { action: 'user.deactivated' } })).toBe(1);
    expect((await post(deactivate, admin.id)).status).toBe(409);
    actAs(await createUser('coordinator'));
    expect((await post(deactivate, admin.id)).status).toBe(403);
    expect((await post(reactivate, learner.id)).status).toBe(403);

    actAs(admin);
    expect((await post(reactivate, learner.id)).status).toBe(200);
    expect(await verifyCredentials(learner.email, 'test-password-123', 'deactivation-test')).toMatchObject({ id: learner.id, sessionVersion: 1 });
    // The session from before the deactivation stays ended (its version is the old one).
    actAs(learner);
    await expect(requireRole('learner')).rejects.toMatchObject({ status: 401 });
    expect(await db().AuditLog.count({ where: { action: 'user.reactivated' } })).toBe(1);
  });
});

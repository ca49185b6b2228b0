import { beforeEach, describe, expect, it } from 'vitest';
import { POST as register } from '@/app/api/register/route';
import { requireRole } from '@/lib/auth/guard';
import { authOptions } from '@/lib/auth/options';
import { endSessions } from '@/lib/auth/sessions';
import { verifyCredentials, type SessionUser } from '@/lib/auth/users';
import { changeRoles } from '@/lib/users-admin';
import { db } from '@/models';
import { createUser, resetDatabase } from '../support/db';
import { jsonRequest } from '../support/request';
import { actAs } from '../support/session';

beforeEach(async () => {
  await resetDatabase();
  actAs(null);
});

describe('POST /api/register', () => {
  it('creates a learner and never stores the password itself', async () => {
    const response = await register(jsonRequest('/api/register', { name: 'Juniper Vale', email: 'Juniper@Example.org', password: 'a long pass phrase' }), {});
    expect(response.status).toBe(201);
    const body = await response.json();
    expect(body.user).toMatchObject({ email: 'juniper@example.org', roles: ['learner'] });
    const row = await db().User.findOne({ where: { email: 'juniper@example.org' } });
    expect(row?.passwordHash).toMatch(/^\$2[aby]\$10\$/);
    expect(row?.passwordHash).not.toContain('a long pass phrase');
    expect(await db().AuditLog.count({ where: { action: 'user.registered' } })).toBe(1);
  });

  it('answers a second registration of the same e-mail with 409 and no second row', async () => {
    const input = { name: 'Juniper Vale', email: 'juniper@example.org', password: 'a long pass phrase' };
    expect((await register(jsonRequest('/api/register', input), {})).status).toBe(201);
    const again = await register(jsonRequest('/api/register', { ...input, email: 'JUNIPER@example.org' }), {});
    expect(again.status).toBe(409);
    expect((await again.json()).fields.email[0]).toMatch(/already exists/);
    expect(await db().User.count()).toBe(1);
  });

  it('answers 400 naming each wrong field, and a short password with a clear message', async () => {
    const response = await register(jsonRequest('/api/register', { name: '', email: 'nope', password: 'short' }), {});
    expect(response.status).toBe(400);
    const body = await response.json();
    expect(Object.keys(body.fields).sort()).toEqual(['email', 'name', 'password']);
    expect(body.fields.password[0]).toBe('Use at least 10 characters for your password.');
    expect(await db().User.count()).toBe(0);
  });

  it('answers malformed JSON with 400, not 500', async () => {
    const response = await register(jsonRequest('/api/register', '{"name": "x", '), {});
    expect(response.status).toBe(400);
  });
});

describe('verifyCredentials', () => {
  it('gives the same answer for a wrong password and an unknown e-mail', async () => {
    const user = await createUser('learner', { email: 'hazel@test.example' });
    expect(await verifyCredentials('hazel@test.example', 'test-password-123', 'a1')).toMatchObject({ id: user.id, roles: ['learner'] });
    expect(await verifyCredentials('hazel@test.example', 'wrong-password-1', 'a1')).toBeNull();
    expect(await verifyCredentials('nobody@test.example', 'wrong-password-1', 'a1')).toBeNull();
  });
});

describe('requireRole', () => {
  it('is 401 signed out, 403 for the wrong role, and passes the right one', async () => {
    await expect(requireRole('coordinator')).rejects.toMatchObject({ status: 401 });
    const learner = await createUser('learner');
    actAs(learner);
    await expect(requireRole('coordinator')).rejects.toMatchObject({ status: 403 });
    await expect(requireRole('learner')).resolves.toMatchObject({ id: learner.id });
    const admin = await createUser('admin');
    actAs(admin);
    await expect(requireRole('coordinator')).resolves.toMatchObject({ roles: ['admin'] });
  });
});

describe('changeRoles', () => {
  it('changes a set of roles with an audit entry, and refuses to remove one’s own admin role', async () => {
    const admin = await createUser('admin');
    const learner = await createUser('learner');
    await changeRoles(admin.id, { userId: learner.id, roles: ['instructor', 'learner'] });
    expect((await db().User.findByPk(learner.id))?.roles).toEqual(['learner', 'instructor']);
    const [entry] = await db().AuditLog.findAll({ where: { action: 'user.roles_changed' } });
    expect(entry.data).toEqual({ from: ['learner'], to: ['learner', 'instructor'] });
    // The same set again changes nothing and writes nothing.
    await changeRoles(admin.id, { userId: learner.id, roles: ['learner', 'instructor'] });
    expect(await db().AuditLog.count({ where: { action: 'user.roles_changed' } })).toBe(1);
    await expect(changeRoles(admin.id, { userId: admin.id, roles: ['learner', 'coordinator'] })).rejects.toMatchObject({ status: 409 });
    await changeRoles(admin.id, { userId: admin.id, roles: ['admin', 'learner'] });
    expect((await db().User.findByPk(admin.id))?.roles).toEqual(['learner', 'admin']);
  });

  it('applies from the next request of a session that is already signed in, and an account removed is signed out', async () => {
    const admin = await createUser('admin');
    const instructor = await createUser('instructor');
    // The session token still says instructor (written at sign-in, as actAs encodes it).
    actAs(instructor);
    await expect(requireRole('instructor')).resolves.toMatchObject({ id: instructor.id, roles: ['instructor'] });
    await changeRoles(admin.id, { userId: instructor.id, roles: ['learner'] });
    await expect(requireRole('instructor')).rejects.toMatchObject({ status: 403 });
    await expect(requireRole()).resolves.toMatchObject({ id: instructor.id, roles: ['learner'] });
    await changeRoles(admin.id, { userId: instructor.id, roles: ['coordinator', 'learner'] });
    await expect(requireRole('coordinator')).resolves.toMatchObject({ roles: ['learner', 'coordinator'] });
    // The browser's session (/api/auth/session runs the jwt callback) follows as well; a token from
    // before role sets (a single `role`) is still read, and rewritten with the set.
    const jwt = authOptions().callbacks!.jwt!;
    const token = await jwt({
      token: { uid: instructor.id, role: 'instructor', email: instructor.email, name: instructor.name, sv: 0, sat: Math.floor(Date.now() / 1000) },
      user: undefined as never,
      account: null,
    });
    expect(token.roles).toEqual(['learner', 'coordinator']);
    expect(token.role).toBeUndefined();
    await db().User.destroy({ where: { id: instructor.id } });
    await expect(requireRole()).rejects.toMatchObject({ status: 401 });
  });
});

describe('sessions that end', () => {
  const jwt = () => authOptions().callbacks!.jwt!;
  const tokenOf = (user: SessionUser, stamp: { sv: number; sat: number }) => ({
    uid: user.id,
    roles: user.roles,
    email: user.email,
    name: user.name,
    ...stamp,
  });
  const now = () => Math.floor(Date.now() / 1000);

  it('ends every session of a user when the session version is raised, on the server and in the browser', async () => {
    const learner = await createUser('learner');
    actAs(learner);
    await expect(requireRole()).resolves.toMatchObject({ id: learner.id });
    await expect(jwt()({ token: tokenOf(learner, { sv: 0, sat: now() }), user: undefined as never, account: null })).resolves.toMatchObject({
      uid: learner.id,
    });
    await endSessions(learner.id);
    expect((await db().User.findByPk(learner.id))?.sessionVersion).toBe(1);
    await expect(requireRole()).rejects.toMatchObject({ status: 401 });
    await expect(jwt()({ token: tokenOf(learner, { sv: 0, sat: now() }), user: undefined as never, account: null })).rejects.toThrow('Session ended');
    // A new sign-in records the new version.
    const signedIn = await verifyCredentials(learner.email, 'test-password-123', 'sessions-test');
    expect(signedIn?.sessionVersion).toBe(1);
    await expect(jwt()({ token: tokenOf(learner, { sv: 1, sat: now() }), user: undefined as never, account: null })).resolves.toMatchObject({ sv: 1 });
  });

  it('refuses a deactivated account: its session ends and it cannot sign in, while its row stays', async () => {
    const learner = await createUser('learner');
    actAs(learner);
    await db().User.update({ deactivatedAt: new Date() }, { where: { id: learner.id } });
    await expect(requireRole()).rejects.toMatchObject({ status: 401 });
    expect(await verifyCredentials(learner.email, 'test-password-123', 'sessions-test')).toBeNull();
    expect(await db().User.count({ where: { id: learner.id } })).toBe(1);
  });

  it('ends a session older than SESSION_MAX_DAYS however fresh its cookie', async () => {
    const learner = await createUser('learner');
    const eightDaysAgo = now() - 8 * 24 * 60 * 60;
    await expect(jwt()({ token: tokenOf(learner, { sv: 0, sat: eightDaysAgo }), user: undefined as never, account: null })).rejects.toThrow('Session ended');
  });

  it('stamps a new sign-in with the account version and the time', async () => {
    const learner = await createUser('learner');
    const before = now();
    const token = await jwt()({
      token: {} as never,
      user: { id: String(learner.id), email: learner.email, name: learner.name, roles: ['learner'], sessionVersion: 3 },
      account: null,
    });
    expect(token).toMatchObject({ uid: learner.id, sv: 3 });
    expect(token.sat).toBeGreaterThanOrEqual(before);
  });
});

import { beforeEach, describe, expect, it } from 'vitest';
import { POST as invite } from '@/app/api/admin/invitations/route';
import { POST as accept } from '@/app/api/invitations/accept/route';
import { verifyCredentials } from '@/lib/auth/users';
import { db } from '@/models';
import { createUser, resetDatabase } from '../support/db';
import { jsonRequest } from '../support/request';
import { actAs } from '../support/session';

const sendInvite = (body: unknown) => invite(jsonRequest('/api/admin/invitations', body), undefined as never);
const sendAccept = (body: unknown) => accept(jsonRequest('/api/invitations/accept', body), undefined as never);

/** The token of the newest invitation e-mail to an address, read from the outbox as the invitee's mailbox would show it. */
async function tokenFromMail(to: string): Promise<string> {
  const mail = await db().OutboxEmail.findOne({ where: { toAddress: to, kind: 'invitation.staff' }, order: [['id', 'DESC']] });
  const match = mail?.textBody.match(/\/invitation\?token=([A-Za-z0-9_-]{43})/);
  if (!match) throw new Error(`no invitation link in the mail to ${to}`);
  return match[1];
}

describe('staff invitations', () => {
  let admin: Awaited<ReturnType<typeof createUser>>;
  beforeEach(async () => {
    await resetDatabase();
    admin = await createUser('admin', { name: 'Dale Admin' });
    actAs(admin);
  });

  it('is sent by an admin only, with a set of roles, and accepted once: the account gets the roles and a confirmed address', async () => {
    for (const who of [null, await createUser('coordinator'), await createUser(['learner', 'instructor'])]) {
      actAs(who);
      expect((await sendInvite({ email: 'new.staff@county.example', roles: ['instructor'] })).status).toBe(who ? 403 : 401);
    }
    actAs(admin);
    expect((await sendInvite({ email: 'not-an-address', roles: ['instructor'] })).status).toBe(400);
    expect((await sendInvite({ email: 'new.staff@county.example', roles: [] })).status).toBe(400);
    const sent = await sendInvite({ email: 'New.Staff@County.example', roles: ['coordinator', 'instructor'] });
    expect(sent.status).toBe(201);
    const { invitation } = await sent.json();
    expect(invitation).toMatchObject({ email: 'new.staff@county.example', roles: ['instructor', 'coordinator'], replaced: 0 });
    // Seven days, to the second the row was written.
    expect(new Date(invitation.expiresAt).getTime() - Date.now()).toBeGreaterThan(7 * 86_400_000 - 60_000);
    const row = await db().StaffInvitation.findByPk(invitation.id);
    const token = await tokenFromMail('new.staff@county.example');
    // Only the hash is stored.
    expect(row?.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(row?.tokenHash).not.toContain(token);
    const mail = await db().OutboxEmail.findOne({ where: { kind: 'invitation.staff' } });
    expect(mail?.textBody).toContain('Dale Admin invites you');
    expect(mail?.textBody).toContain('coordinator and instructor');

    actAs(null);
    expect((await sendAccept({ token, name: 'Nell Staff', password: 'short' })).status).toBe(400);
    const accepted = await sendAccept({ token, name: 'Nell Staff', password: 'a long enough password' });
    expect(accepted.status).toBe(201);
    const user = (await db().User.findOne({ where: { email: 'new.staff@county.example' } }))!;
    expect({ name: user.name, roles: user.roles, confirmed: user.emailVerifiedAt !== null }).toEqual({
      name: 'Nell Staff',
      roles: ['instructor', 'coordinator'],
      confirmed: true,
    });
    expect(await verifyCredentials('new.staff@county.example', 'a long enough password', 'invite-test')).toMatchObject({ id: user.id });
    // The link works once.
    const again = await sendAccept({ token, name: 'Someone Else', password: 'another long password' });
    expect(again.status).toBe(409);
    expect((await again.json()).message).toMatch(/already been used/);
    expect(await db().User.count({ where: { email: 'new.staff@county.example' } })).toBe(1);
    const actions = (await db().AuditLog.findAll({ order: [['id', 'ASC']] })).map((e) => [e.action, e.actorId]);
    expect(actions).toEqual([
      ['invitation.sent', admin.id],
      ['invitation.accepted', user.id],
    ]);
  });

  it('refuses an expired link, and an unknown one', async () => {
    await sendInvite({ email: 'late@county.example', roles: ['instructor'] });
    const token = await tokenFromMail('late@county.example');
    await db().StaffInvitation.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { email: 'late@county.example' } });
    const answer = await sendAccept({ token, name: 'Late Comer', password: 'a long enough password' });
    expect(answer.status).toBe(409);
    expect((await answer.json()).message).toMatch(/expired/);
    expect(await db().User.count({ where: { email: 'late@county.example' } })).toBe(0);
    expect((await sendAccept({ token: 'A'.repeat(43), name: 'Nobody', password: 'a long enough password' })).status).toBe(404);
  });

  it('sent twice: the second invitation replaces the first, whose link no longer works', async () => {
    await sendInvite({ email: 'twice@county.example', roles: ['instructor'] });
    const first = await tokenFromMail('twice@county.example');
    const second = await sendInvite({ email: 'twice@county.example', roles: ['instructor', 'learner'] });
    expect((await second.json()).invitation.replaced).toBe(1);
    const latest = await tokenFromMail('twice@county.example');
    expect(latest).not.toBe(first);
    const old = await sendAccept({ token: first, name: 'Twice Invited', password: 'a long enough password' });
    expect(old.status).toBe(409);
    expect((await old.json()).message).toMatch(/newer invitation/);
    expect((await sendAccept({ token: latest, name: 'Twice Invited', password: 'a long enough password' })).status).toBe(201);
    expect((await db().User.findOne({ where: { email: 'twice@county.example' } }))?.roles).toEqual(['learner', 'instructor']);
  });

  it('refuses an address that already has an account, when inviting and when accepting', async () => {
    const learner = await createUser('learner', { email: 'taken@county.example' });
    const answer = await sendInvite({ email: 'taken@county.example', roles: ['instructor'] });
    expect(answer.status).toBe(409);
    expect((await answer.json()).message).toMatch(/already exists/);
    // An account made after the invitation (registering with the same address) wins; the link then refuses.
    await sendInvite({ email: 'later@county.example', roles: ['instructor'] });
    const token = await tokenFromMail('later@county.example');
    await createUser('learner', { email: 'later@county.example' });
    expect((await sendAccept({ token, name: 'Later', password: 'a long enough password' })).status).toBe(409);
    expect((await db().User.findByPk(learner.id))?.roles).toEqual(['learner']);
  });
});

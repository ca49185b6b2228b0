import 'server-only';
import { createHash, randomBytes } from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import { hashPassword } from '@/lib/auth/users';
import { enqueueEmail } from '@/lib/email/outbox';
import { staffInvitationEmail } from '@/lib/email/templates';
import { getEnv } from '@/lib/env';
import { AppError } from '@/lib/errors';
import { getProgramIdentity } from '@/lib/program/settings';
import { normalizeRoles, type Role } from '@/lib/roles';
import type { AcceptInvitationInput, InviteInput } from '@/lib/validations/invitation';
import { db } from '@/models';
import { CLOSED_MESSAGE, INVITATION_DAYS, invitationState, type InvitationState } from './invitation-state';

const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');

const EXISTING_ACCOUNT = 'An account with that e-mail address already exists. Change its roles on the Users and roles page instead of inviting it.';

async function refuseExistingAccount(emailAddress: string, transaction: Transaction): Promise<void> {
  if (await db().User.count({ where: { email: emailAddress }, transaction })) {
    throw new AppError('conflict', EXISTING_ACCOUNT, { fields: { email: ['An account with that e-mail address already exists.'] } });
  }
}

export type SentInvitation = { id: number; email: string; roles: Role[]; expiresAt: Date; replaced: number };

/**
 * Invites a staff member: a single-use link valid for INVITATION_DAYS, sent through the outbox in the
 * same transaction. An address that already has an account is refused (its roles are changed on the
 * users page; an invitation would let whoever holds the link choose that person's password). A new
 * invitation to an address replaces every open one, so only the newest link works.
 */
export async function inviteStaff(actorId: number, input: InviteInput, now = new Date()): Promise<SentInvitation> {
  const { StaffInvitation, User, AuditLog, sequelize } = db();
  const roles = normalizeRoles(input.roles);
  const token = randomBytes(32).toString('base64url');
  return sequelize.transaction(async (transaction) => {
    await refuseExistingAccount(input.email, transaction);
    const [replaced] = await StaffInvitation.update(
      { replacedAt: now },
      { where: { email: input.email, acceptedAt: null, replacedAt: null, expiresAt: { [Op.gt]: now } }, transaction },
    );
    const invitation = await StaffInvitation.create(
      { email: input.email, roles, tokenHash: hashToken(token), invitedById: actorId, expiresAt: new Date(now.getTime() + INVITATION_DAYS * 86_400_000) },
      { transaction },
    );
    const [inviter, program] = await Promise.all([User.findByPk(actorId, { attributes: ['name'], transaction }), getProgramIdentity({ transaction })]);
    const url = `${getEnv().APP_URL.replace(/\/$/, '')}/invitation?token=${token}`;
    await enqueueEmail(
      staffInvitationEmail({
        to: input.email,
        inviterName: inviter?.name ?? 'An admin',
        programName: program.name,
        roles,
        acceptUrl: url,
        expiresAt: invitation.expiresAt,
        timeZone: program.timeZone,
      }),
      { transaction },
    );
    await AuditLog.create(
      { actorId, action: 'invitation.sent', subjectType: 'invitation', subjectId: String(invitation.id), data: { email: input.email, roles, replaced } },
      { transaction },
    );
    return { id: invitation.id, email: input.email, roles, expiresAt: invitation.expiresAt, replaced };
  });
}

export type InvitationView = { state: InvitationState; email: string; roles: Role[]; expiresAt: Date } | null;

/** The invitation a link names, for its page; null when no invitation has that token. */
export async function findInvitation(token: string, now = new Date()): Promise<InvitationView> {
  const row = await db().StaffInvitation.findOne({ where: { tokenHash: hashToken(token) } });
  return row ? { state: invitationState(row, now), email: row.email, roles: row.roles, expiresAt: row.expiresAt } : null;
}

/**
 * Accepts an open invitation: makes the account with the invited roles, the name and password the
 * invitee chose, and the address confirmed (the link reached it). Once only; audited.
 */
export async function acceptInvitation(input: AcceptInvitationInput, now = new Date()): Promise<{ userId: number; email: string }> {
  const { StaffInvitation, User, AuditLog, sequelize } = db();
  const passwordHash = await hashPassword(input.password);
  return sequelize.transaction(async (transaction) => {
    const invitation = await StaffInvitation.findOne({ where: { tokenHash: hashToken(input.token) }, transaction, lock: transaction.LOCK.UPDATE });
    if (!invitation) throw new AppError('not_found', 'This invitation link is not valid. Open it again from the e-mail, or ask for a new one.');
    const state = invitationState(invitation, now);
    if (state !== 'open') throw new AppError('conflict', CLOSED_MESSAGE[state], { extra: { state } });
    await refuseExistingAccount(invitation.email, transaction);
    const user = await User.create({ email: invitation.email, name: input.name, roles: invitation.roles, passwordHash, emailVerifiedAt: now }, { transaction });
    await invitation.update({ acceptedAt: now, acceptedUserId: user.id }, { transaction });
    await AuditLog.create(
      {
        actorId: user.id,
        action: 'invitation.accepted',
        subjectType: 'user',
        subjectId: String(user.id),
        data: { invitationId: invitation.id, roles: invitation.roles, invitedById: invitation.invitedById },
      },
      { transaction },
    );
    return { userId: user.id, email: user.email };
  });
}

export type PendingInvitation = { id: number; email: string; roles: Role[]; expiresAt: Date; createdAt: Date; invitedBy: string | null };

/** Invitations still open, newest first, for the admin's invitations page. */
export async function fetchOpenInvitations(now = new Date()): Promise<PendingInvitation[]> {
  const { StaffInvitation, User } = db();
  const rows = await StaffInvitation.findAll({
    where: { acceptedAt: null, replacedAt: null, expiresAt: { [Op.gt]: now } },
    include: [{ model: User, as: 'invitedBy', attributes: ['name'] }],
    order: [['createdAt', 'DESC']],
    limit: 100,
  });
  return rows.map((r) => {
    const inviter = (r as unknown as { invitedBy?: { name: string } | null }).invitedBy;
    return { id: r.id, email: r.email, roles: r.roles, expiresAt: r.expiresAt, createdAt: r.createdAt, invitedBy: inviter?.name ?? null };
  });
}

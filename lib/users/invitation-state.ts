/** How long an invitation link works (days). */
export const INVITATION_DAYS = 7;

export type InvitationState = 'open' | 'accepted' | 'expired' | 'replaced';
type Facts = { expiresAt: Date; acceptedAt: Date | null; replacedAt: Date | null };

/** What a link is now: used once, replaced by a newer invitation to the same address, past its expiry, or open. */
export function invitationState(invitation: Facts, now: Date = new Date()): InvitationState {
  if (invitation.acceptedAt) return 'accepted';
  if (invitation.replacedAt) return 'replaced';
  if (now.getTime() >= invitation.expiresAt.getTime()) return 'expired';
  return 'open';
}

/** What the invitee reads when the link no longer works. */
export const CLOSED_MESSAGE: Record<Exclude<InvitationState, 'open'>, string> = {
  accepted: 'This invitation has already been used to make an account. Sign in with that account instead.',
  replaced: 'A newer invitation was sent to this address, and this link no longer works. Use the link in the newest e-mail.',
  expired: `This invitation has expired (links work for ${INVITATION_DAYS} days). Ask the program's admin to send a new one.`,
};

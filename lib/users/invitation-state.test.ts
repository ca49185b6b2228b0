import { describe, expect, it } from 'vitest';
import { invitationState } from './invitation-state';

describe('invitationState', () => {
  const now = new Date('2026-12-05T12:00:00Z');
  const base = { expiresAt: new Date('2026-12-12T12:00:00Z'), acceptedAt: null, replacedAt: null };
  it('is open before its expiry and expired from the instant of it', () => {
    expect(invitationState(base, now)).toBe('open');
    expect(invitationState(base, new Date('2026-12-12T11:59:59Z'))).toBe('open');
    expect(invitationState(base, new Date('2026-12-12T12:00:00Z'))).toBe('expired');
  });
  it('says accepted, then replaced, before it looks at the date', () => {
    const late = new Date('2027-01-01T00:00:00Z');
    expect(invitationState({ ...base, acceptedAt: now }, late)).toBe('accepted');
    expect(invitationState({ ...base, replacedAt: now }, late)).toBe('replaced');
    expect(invitationState({ ...base, acceptedAt: now, replacedAt: now }, now)).toBe('accepted');
  });
});

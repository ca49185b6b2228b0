import { describe, expect, it } from 'vitest';
import { decisionRight } from './decision-rights';

const facts = (
  viewer: { id: number; roles: ('learner' | 'instructor' | 'coordinator' | 'admin')[] },
  over: Partial<{ learnerId: number; workshopInstructorId: number | null; claimedById: number | null }> = {},
) => ({
  viewer,
  learnerId: 1,
  workshopInstructorId: 2,
  claimedById: null,
  ...over,
});

describe('decisionRight', () => {
  it('lets a coordinator, the workshop instructor and the claimant decide', () => {
    expect(decisionRight(facts({ id: 9, roles: ['coordinator'] }))).toEqual({ may: true, as: 'coordinator' });
    expect(decisionRight(facts({ id: 9, roles: ['admin'] }))).toEqual({ may: true, as: 'coordinator' });
    expect(decisionRight(facts({ id: 2, roles: ['instructor'] }))).toEqual({ may: true, as: 'workshop instructor' });
    expect(decisionRight(facts({ id: 3, roles: ['instructor'] }, { claimedById: 3 }))).toEqual({ may: true, as: 'claimant' });
  });

  it('asks any other instructor to claim first, and refuses while someone else holds the claim', () => {
    expect(decisionRight(facts({ id: 3, roles: ['instructor'] }))).toEqual({ may: false, reason: 'claim_first' });
    expect(decisionRight(facts({ id: 3, roles: ['instructor'] }, { claimedById: 4 }))).toEqual({ may: false, reason: 'claimed_by_other' });
    expect(decisionRight(facts({ id: 3, roles: ['instructor'] }, { workshopInstructorId: null }))).toEqual({ may: false, reason: 'claim_first' });
  });

  it('never lets anyone decide on their own practical, not even a coordinator who teaches their own workshop', () => {
    expect(decisionRight(facts({ id: 1, roles: ['coordinator'] }))).toEqual({ may: false, reason: 'own' });
    expect(decisionRight(facts({ id: 1, roles: ['instructor'] }, { workshopInstructorId: 1, claimedById: 1 }))).toEqual({ may: false, reason: 'own' });
  });

  it('refuses a learner', () => {
    expect(decisionRight(facts({ id: 5, roles: ['learner'] }))).toEqual({ may: false, reason: 'not_instructor' });
  });
});

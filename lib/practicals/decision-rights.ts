import { roleAllows, type Role } from '@/lib/roles';

export type DecisionFacts = {
  viewer: { id: number; roles: readonly Role[] };
  learnerId: number;
  workshopInstructorId: number | null;
  claimedById: number | null;
};

export type DecisionRight =
  { may: true; as: 'coordinator' | 'workshop instructor' | 'claimant' } | { may: false; reason: 'own' | 'not_instructor' | 'claim_first' | 'claimed_by_other' };

/**
 * Who may approve or ask for changes on a round: a coordinator, the instructor of the learner's
 * workshop, or the instructor holding the claim; never the learner themself, whatever their roles.
 */
export function decisionRight({ viewer, learnerId, workshopInstructorId, claimedById }: DecisionFacts): DecisionRight {
  if (viewer.id === learnerId) return { may: false, reason: 'own' };
  if (!roleAllows(viewer.roles, ['instructor'])) return { may: false, reason: 'not_instructor' };
  if (roleAllows(viewer.roles, ['coordinator'])) return { may: true, as: 'coordinator' };
  if (workshopInstructorId === viewer.id) return { may: true, as: 'workshop instructor' };
  if (claimedById === viewer.id) return { may: true, as: 'claimant' };
  return { may: false, reason: claimedById === null ? 'claim_first' : 'claimed_by_other' };
}

export const REFUSAL: Record<Exclude<DecisionRight, { may: true }>['reason'], string> = {
  own: 'Nobody decides on their own practical: another instructor or a coordinator reviews it.',
  not_instructor: 'Only instructors and coordinators review practicals.',
  claim_first: "Claim this submission first: only a coordinator, the instructor of the learner's workshop or the instructor who claimed it may decide.",
  claimed_by_other: 'Another instructor has claimed this submission; a coordinator can release the claim.',
};

import { REFUSAL, type DecisionRight } from '@/lib/practicals/decision-rights';
import { roleAllows, type Role } from '@/lib/roles';
import { ClaimControls } from './claim-controls';
import { ReviewForm } from './review-form';

/**
 * The decision part of a submission page: the rubric for those who may decide, otherwise why not,
 * with the claim button; the claimant and coordinators see the release button.
 */
export function DecisionPanel({
  practicalId,
  round,
  right,
  claim,
  viewer,
}: {
  practicalId: number;
  round: number;
  right: DecisionRight;
  claim: { byId: number; byName: string } | null;
  viewer: { id: number; roles: readonly Role[] };
}) {
  const mayRelease = claim !== null && (claim.byId === viewer.id || roleAllows(viewer.roles, ['coordinator']));
  return (
    <div className="space-y-4">
      {claim ? <p className="text-sm text-ink-soft">{claim.byId === viewer.id ? 'You have claimed this submission.' : `Claimed by ${claim.byName}.`}</p> : null}
      {right.may ? <ReviewForm practicalId={practicalId} round={round} /> : <p className="text-sm">{REFUSAL[right.reason]}</p>}
      {!right.may && right.reason === 'claim_first' ? <ClaimControls practicalId={practicalId} action="claim" /> : null}
      {mayRelease ? <ClaimControls practicalId={practicalId} action="release" /> : null}
    </div>
  );
}

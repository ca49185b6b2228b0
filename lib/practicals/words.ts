// The kitchen's words for a practical batch: one name per state, used by every badge, filter,
// history, e-mail and checklist. The stored values ('submitted', 'changes_requested', 'approved') stay.
export type PracticalState = 'submitted' | 'changes_requested' | 'approved';
export type PracticalDecision = 'approved' | 'changes_requested';

/** The one name of each state. */
export const STATE_NAME: Record<PracticalState, string> = {
  submitted: 'Waiting at the Tasting table',
  changes_requested: 'Needs another batch',
  approved: 'Passed the table',
};

/** What an instructor chooses, as the choice reads on the review form. */
export const DECISION_ACTION: Record<PracticalDecision, string> = {
  approved: 'Pass this batch',
  changes_requested: 'Ask for another batch',
};

const ORDINALS = ['first', 'second', 'third', 'fourth', 'fifth', 'sixth', 'seventh', 'eighth', 'ninth', 'tenth'];

/** "first batch", "second batch" … ("batch 11" past the tenth). */
export function batchName(round: number): string {
  return round >= 1 && round <= ORDINALS.length ? `${ORDINALS[round - 1]} batch` : `batch ${round}`;
}

/** The same, starting with a capital, for headings. */
export function batchTitle(round: number): string {
  const name = batchName(round);
  return name[0].toUpperCase() + name.slice(1);
}

import { describe, expect, it } from 'vitest';
import { batchTitle, DECISION_ACTION, STATE_NAME, batchName } from './words';

describe('practical words', () => {
  it('names each batch in words, then by number past the tenth', () => {
    expect(batchName(1)).toBe('first batch');
    expect(batchName(2)).toBe('second batch');
    expect(batchName(10)).toBe('tenth batch');
    expect(batchName(11)).toBe('batch 11');
    expect(batchTitle(3)).toBe('Third batch');
  });

  it('gives every state one distinct name and every decision its action', () => {
    expect(new Set(Object.values(STATE_NAME)).size).toBe(3);
    expect(STATE_NAME.approved).toBe('Passed the table');
    expect(STATE_NAME.changes_requested).toBe('Needs another batch');
    expect(DECISION_ACTION).toEqual({ approved: 'Pass this batch', changes_requested: 'Ask for another batch' });
  });
});

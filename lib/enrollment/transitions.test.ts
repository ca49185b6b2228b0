import { describe, expect, it } from 'vitest';
import { ENROLLMENT_STATUSES } from '@/lib/enrollment-status';
import { canTransition, holdsSeat, withdrawnRunKey } from './transitions';

describe('enrollment state machine', () => {
  it('allows exactly the four moves of the design', () => {
    const allowed = ENROLLMENT_STATUSES.flatMap((from) => ENROLLMENT_STATUSES.filter((to) => canTransition(from, to)).map((to) => `${from}->${to}`));
    expect(allowed.sort()).toEqual(['active->completed', 'active->withdrawn', 'awaiting_payment->active', 'awaiting_payment->withdrawn']);
  });

  it('never leaves completed or withdrawn, and never stays put', () => {
    for (const to of ENROLLMENT_STATUSES) {
      expect(canTransition('completed', to)).toBe(false);
      expect(canTransition('withdrawn', to)).toBe(false);
      expect(canTransition(to, to)).toBe(false);
    }
  });

  it('holds a seat only while awaiting payment or active', () => {
    expect(ENROLLMENT_STATUSES.filter(holdsSeat)).toEqual(['awaiting_payment', 'active']);
  });

  it('moves a withdrawn run key out of the way of the unique index, within the column width', () => {
    expect(withdrawnRunKey(17, '4')).toBe('withdrawn:17:4');
    expect(withdrawnRunKey(4_294_967_295, 'self-paced').length).toBeLessThanOrEqual(40);
    expect(withdrawnRunKey(1, '4')).not.toBe(withdrawnRunKey(2, '4'));
  });
});

// The demo's practical batches store the flags the automatic checks gave them (seeders are plain
// JavaScript and cannot call lib/practicals). This keeps those stored flags what the checks give
// today, so the demo never shows a batch with fewer (or other) flags than the product would raise.
import { createRequire } from 'node:module';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkPractical } from '../../lib/practicals/checks';
import type { PracticalDetails } from '../../lib/validations/practical';

const load = createRequire(path.resolve(__dirname, '../../package.json'));
const { DEMO_BATCHES } = load('./seeders/20261201160000-demo-practicals.js') as {
  DEMO_BATCHES: { name: string; details: Partial<PracticalDetails>; flags: unknown[] }[];
};
const { approvedBatch } = load('./seeders/20261201170000-demo-certificates.js') as { approvedBatch: (submittedAt: Date) => Partial<PracticalDetails> };

describe('the demo seed', () => {
  it.each(DEMO_BATCHES.map((b) => [b.name, b] as const))("stores %s's batch with the flags the checks give it", (_name, batch) => {
    // The seeder dates the batch two days before it was submitted; the date is not among the checks.
    const details = { ...batch.details, batchDate: '2026-11-28' };
    expect(batch.flags.length).toBeGreaterThan(0);
    expect(batch.flags).toEqual(checkPractical(details));
  });

  it('stores the approved batches of the certified learners without a flag, as the checks find them', () => {
    expect(checkPractical(approvedBatch(new Date('2024-02-02T16:00:00Z')))).toEqual([]);
  });
});

import { BaseSequencer, type TestSpecification } from 'vitest/node';

// The order of the group of integration and browser files (vitest.config.mts), which share the
// workers: first the two longest browser files (they wait for the build, then run beside the
// integration files), then the integration files, longest first, then the other browser files.
// Without this, a clean clone (no timing cache for vitest to sort by) would start the largest files
// first, and a long file could run alone at the end while the other slots are idle. Times measured
// in `npm test` on this two-core machine, 2026-12-05.
const ORDER = [
  'tests/e2e/phone-layout.test.ts', // 131 s
  'tests/e2e/db-restart.test.ts', // 62 s
  'tests/integration/bad-input.test.ts', // 48 s
  'tests/integration/outbox-senders.test.ts', // 31 s
  'tests/integration/throttle.test.ts', // 15 s
  'tests/integration/admin-create.test.ts', // 12 s
  'tests/integration/', // the other integration files
  'tests/e2e/security.test.ts', // 39 s
];

const rank = (file: TestSpecification) => {
  const i = ORDER.findIndex((entry) => (entry.endsWith('/') ? file.moduleId.includes(`/${entry}`) : file.moduleId.endsWith(`/${entry}`)));
  return i === -1 ? ORDER.length : i;
};

export class LongestFirstSequencer extends BaseSequencer {
  override async sort(files: TestSpecification[]): Promise<TestSpecification[]> {
    const sorted = await super.sort(files);
    return [...sorted].sort((a, b) => rank(a) - rank(b));
  }
}

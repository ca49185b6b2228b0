import { BaseSequencer, type TestSpecification } from 'vitest/node';

// The browser files that take longest start first, so that neither runs alone at the end of
// `npm test` while the other slot is idle (a clean clone has no timing cache for vitest to sort by).
const FIRST = ['tests/e2e/phone-layout.test.ts', 'tests/e2e/db-restart.test.ts'];

export class LongestFirstSequencer extends BaseSequencer {
  override async sort(files: TestSpecification[]): Promise<TestSpecification[]> {
    const sorted = await super.sort(files);
    const rank = (file: TestSpecification) => {
      const i = FIRST.findIndex((name) => file.moduleId.endsWith(name));
      return i === -1 ? FIRST.length : i;
    };
    return [...sorted].sort((a, b) => rank(a) - rank(b));
  }
}

import path from 'node:path';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vitest/config';
import { LongestFirstSequencer } from './tests/setup/sequencer';
import { slotCount } from './tests/setup/slots';

// Integration and browser files run in one group (vitest asks one maxWorkers of a group), so that
// browser files start as soon as their build is ready instead of after the last integration file.
// Each file claims a slot of its own project (tests/setup/slots.ts): at most INTEGRATION_WORKERS
// integration files and E2E_WORKERS browser files run at once; a file whose project's slots are
// all taken waits for one. tests/setup/sequencer.ts orders the group.
const LATER_WORKERS = slotCount('INTEGRATION_WORKERS') + slotCount('E2E_WORKERS');

const root = path.dirname(new URL(import.meta.url).pathname);
const alias = {
  '@': root,
  // server-only throws outside a React server bundle; tests import server modules directly.
  'server-only': path.join(root, 'tests/setup/empty.ts'),
};

export default defineConfig({
  plugins: [react()],
  resolve: { alias },
  test: {
    sequence: { sequencer: LongestFirstSequencer },
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          environment: 'node',
          isolate: false,
          include: ['lib/**/*.test.ts', 'tests/unit/**/*.test.ts', 'content/**/*.test.ts'],
        },
      },
      {
        extends: true,
        test: {
          name: 'components',
          environment: 'jsdom',
          isolate: false,
          include: ['components/**/*.test.tsx', 'app/**/*.test.tsx', 'tests/components/**/*.test.tsx'],
          setupFiles: ['tests/setup/components.ts'],
        },
      },
      {
        extends: true,
        test: {
          name: 'integration',
          environment: 'node',
          // One worker process runs file after file; tests/setup/fresh-file.ts starts each afresh.
          isolate: false,
          include: ['tests/integration/**/*.test.ts'],
          globalSetup: ['tests/setup/integration-global.ts'],
          setupFiles: ['tests/setup/fresh-file.ts', 'tests/setup/integration.ts'],
          // Files run side by side, each on its own database (tests/setup/slots.ts).
          maxWorkers: LATER_WORKERS,
          // After the unit and component tests, in one group with the browser files (see LATER_WORKERS).
          sequence: { groupOrder: 1 },
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'e2e',
          environment: 'node',
          include: ['tests/e2e/**/*.test.ts'],
          globalSetup: ['tests/setup/e2e-global.ts'],
          // Waits for the build and the app, which the global setup starts in the background.
          setupFiles: ['tests/setup/e2e.ts'],
          // Files run side by side, each against its own app, database and fakes (tests/setup/slots.ts).
          maxWorkers: LATER_WORKERS,
          sequence: { groupOrder: 1 },
          testTimeout: 90_000,
          hookTimeout: 300_000,
        },
      },
    ],
  },
});

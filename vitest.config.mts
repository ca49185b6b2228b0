import path from 'node:path';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vitest/config';
import { LongestFirstSequencer } from './tests/setup/sequencer';
import { slotCount } from './tests/setup/slots';

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
          include: ['tests/integration/**/*.test.ts'],
          globalSetup: ['tests/setup/integration-global.ts'],
          setupFiles: ['tests/setup/integration.ts'],
          // Files run side by side, each on its own database (tests/setup/slots.ts).
          maxWorkers: slotCount('INTEGRATION_WORKERS'),
          // After the unit and component tests, before the browser tests (whose build runs meanwhile).
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
          maxWorkers: slotCount('E2E_WORKERS'),
          sequence: { groupOrder: 2 },
          testTimeout: 90_000,
          hookTimeout: 300_000,
        },
      },
    ],
  },
});

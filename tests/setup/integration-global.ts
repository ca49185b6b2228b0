import { rebuildDatabase } from '../../lib/migrator';

// Builds the integration database from nothing once per run: drop, create, migrate.
export default async function setup() {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set: run the tests through `npm test` (scripts/test.sh), which starts MariaDB.');
  await rebuildDatabase(url, { allowed: /^brinewright_test\w*$/, purpose: 'integration tests' });
}

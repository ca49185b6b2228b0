import { rebuildDatabase } from '../../lib/migrator';
import { integrationWorkers, workerDatabaseUrl } from './integration-databases';

// Builds each worker's integration database from nothing once per run: drop, create, migrate.
export default async function setup() {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set: run the tests through `npm test` (scripts/test.sh), which starts MariaDB.');
  const ids = Array.from({ length: integrationWorkers() }, (_, i) => i + 1);
  await Promise.all(ids.map((id) => rebuildDatabase(workerDatabaseUrl(url, id), { allowed: /^brinewright_test\w*$/, purpose: 'integration tests' })));
}

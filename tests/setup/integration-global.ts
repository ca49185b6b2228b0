import { rebuildDatabase } from '../../lib/migrator';
import { slotCount, slotDatabaseUrl, slotList } from './slots';

// Builds each slot's integration database from nothing once per run: drop, create, migrate.
export default async function setup() {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set: run the tests through `npm test` (scripts/test.sh), which starts MariaDB.');
  const slots = slotList(slotCount('INTEGRATION_WORKERS'));
  await Promise.all(slots.map((slot) => rebuildDatabase(slotDatabaseUrl(url, slot), { allowed: /^brinewright_test\w*$/, purpose: 'integration tests' })));
}

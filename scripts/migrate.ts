// Usage: tsx scripts/migrate.ts up | down | seed | unseed | reset
// Reads DATABASE_URL like the app does.
import { createSequelize } from '../lib/db';
import { parseEnv } from '../lib/env';
import { migrator, seeder } from '../lib/migrator';

async function main() {
  const command = process.argv[2] ?? 'up';
  // The demo data holds accounts with published passwords: never in a program's real database by accident.
  if ((command === 'seed' || command === 'reset') && process.env.BRINEWRIGHT_DEMO !== '1') {
    throw new Error(`"${command}" loads the demo data (accounts whose passwords are printed in the README) and "reset" empties the database first; it runs only with BRINEWRIGHT_DEMO=1, which npm run demo and the tests set`);
  }
  const env = parseEnv({ NEXTAUTH_SECRET: 'not-used-by-migrations', ...process.env });
  const sequelize = createSequelize(env.DATABASE_URL);
  try {
    if (command === 'up') {
      const done = await migrator(sequelize).up();
      console.log(`[migrate] applied ${done.length} migration(s)${done.length ? ': ' + done.map((m) => m.name).join(', ') : ''}`);
    } else if (command === 'down') {
      await migrator(sequelize).down();
      console.log('[migrate] reverted the last migration');
    } else if (command === 'seed') {
      const done = await seeder(sequelize).up();
      console.log(`[seed] applied ${done.length} seeder(s)`);
    } else if (command === 'unseed') {
      await seeder(sequelize).down({ to: 0 });
      console.log('[seed] reverted every seeder');
    } else if (command === 'reset') {
      await seeder(sequelize).down({ to: 0 });
      await migrator(sequelize).down({ to: 0 });
      await migrator(sequelize).up();
      await seeder(sequelize).up();
      console.log('[migrate] database rebuilt and seeded');
    } else {
      throw new Error(`unknown command "${command}": use up, down, seed, unseed or reset`);
    }
  } finally {
    await sequelize.close();
  }
}

main().catch((error) => {
  console.error(`[migrate] ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});

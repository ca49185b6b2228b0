// Usage: tsx scripts/migrate.ts up | sync | down | seed | unseed | reset
// Reads DATABASE_URL like the app does. `up` applies the migrations and then brings the courses
// table in line with content/courses/; `sync` does only the second part.
import { createSequelize } from '../lib/db';
import { parseEnv } from '../lib/env';
import { syncCourses, type SyncReport } from '../lib/courses/sync';
import { migrateAndSync, migrator, seeder } from '../lib/migrator';

function printCourses(report: SyncReport) {
  console.log(`[courses] ${report.lines.length ? report.lines.join('; ') : 'in line with content/courses/, nothing changed'}`);
}

async function main() {
  const command = process.argv[2] ?? 'up';
  // The demo data holds accounts with published passwords: never in a program's real database by accident.
  if ((command === 'seed' || command === 'reset') && process.env.BRINEWRIGHT_DEMO !== '1') {
    throw new Error(
      `"${command}" loads the demo data (accounts whose passwords are printed in the README) and "reset" empties the database first; it runs only with BRINEWRIGHT_DEMO=1, which npm run demo and the tests set`,
    );
  }
  const env = parseEnv({ NEXTAUTH_SECRET: 'not-used-by-migrations', ...process.env });
  const sequelize = createSequelize(env.DATABASE_URL);
  try {
    if (command === 'up') {
      const { migrations, courses } = await migrateAndSync(sequelize);
      console.log(`[migrate] applied ${migrations.length} migration(s)${migrations.length ? ': ' + migrations.join(', ') : ''}`);
      printCourses(courses);
    } else if (command === 'sync') {
      printCourses(await syncCourses(sequelize));
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
      printCourses((await migrateAndSync(sequelize)).courses);
      await seeder(sequelize).up();
      console.log('[migrate] database rebuilt and seeded');
    } else {
      throw new Error(`unknown command "${command}": use up, sync, down, seed, unseed or reset`);
    }
  } finally {
    await sequelize.close();
  }
}

main().catch((error) => {
  console.error(`[migrate] ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});

import path from 'node:path';
import { createRequire } from 'node:module';
import { Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import { syncCourses } from './courses/sync';
import { createSequelize } from './db';

type Step = { up: (qi: unknown, S: typeof Sequelize) => Promise<unknown>; down: (qi: unknown, S: typeof Sequelize) => Promise<unknown> };

// Migrations and seeders keep the sequelize-cli shape (up/down with queryInterface and Sequelize),
// so either umzug here or `npx sequelize-cli` can run them.
function umzugFor(sequelize: Sequelize, folder: 'migrations' | 'seeders', tableName: string) {
  const root = process.env.BRINEWRIGHT_ROOT ?? process.cwd();
  const load = createRequire(path.join(root, 'package.json'));
  return new Umzug({
    migrations: {
      glob: [`${folder}/*.js`, { cwd: root }],
      resolve: ({ name, path: file, context }) => {
        const step = load(path.resolve(root, file!)) as Step;
        return {
          name,
          up: async () => step.up(context, Sequelize),
          down: async () => step.down(context, Sequelize),
        };
      },
    },
    context: sequelize.getQueryInterface(),
    // Each storage needs its own model name: umzug's default ("SequelizeMeta") is shared, so the
    // second storage made on one Sequelize instance replaced the first one's model, and
    // `npm run db:reset` reverted the migrations against the seeders' table (reverting nothing).
    storage: new SequelizeStorage({ sequelize, tableName, modelName: tableName }),
    logger: undefined,
  });
}

export const migrator = (sequelize: Sequelize) => umzugFor(sequelize, 'migrations', 'SequelizeMeta');
export const seeder = (sequelize: Sequelize) => umzugFor(sequelize, 'seeders', 'SequelizeData');

/** What `npm run db:migrate` does: the pending migrations, then the course rows brought in line with content/courses/. */
export async function migrateAndSync(sequelize: Sequelize): Promise<{ migrations: string[]; courses: Awaited<ReturnType<typeof syncCourses>> }> {
  const done = await migrator(sequelize).up();
  return { migrations: done.map((m) => m.name), courses: await syncCourses(sequelize) };
}

/**
 * Drops and recreates the database named in `url`, then migrates it (and, with `seed`, brings the
 * courses in from content/ and seeds the demo program).
 * Only names matching `allowed` are touched, so a test or benchmark can never wipe the demo's data.
 */
export async function rebuildDatabase(url: string, options: { allowed: RegExp; purpose: string; seed?: boolean }): Promise<void> {
  const name = decodeURIComponent(new URL(url).pathname.slice(1));
  if (!options.allowed.test(name)) throw new Error(`Refusing to rebuild "${name}": ${options.purpose} only use databases matching ${options.allowed}`);
  const serverUrl = new URL(url);
  serverUrl.pathname = '/information_schema';
  const server = createSequelize(serverUrl.toString());
  try {
    // Raw SQL: DDL on the server itself; there is no model for a database.
    await server.query(`DROP DATABASE IF EXISTS \`${name}\``);
    await server.query(`CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  } finally {
    await server.close();
  }
  const sequelize = createSequelize(url);
  try {
    if (options.seed) {
      await migrateAndSync(sequelize);
      await seeder(sequelize).up();
    } else {
      await migrator(sequelize).up();
    }
  } finally {
    await sequelize.close();
  }
}

/** Polls `url` until it answers 2xx, or throws after `timeoutMs`. */
export async function waitForOk(url: string, timeoutMs: number): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`${url} did not answer within ${timeoutMs} ms`);
}

import path from 'node:path';
import { createRequire } from 'node:module';
import { Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';

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
    storage: new SequelizeStorage({ sequelize, tableName }),
    logger: undefined,
  });
}

export const migrator = (sequelize: Sequelize) => umzugFor(sequelize, 'migrations', 'SequelizeMeta');
export const seeder = (sequelize: Sequelize) => umzugFor(sequelize, 'seeders', 'SequelizeData');

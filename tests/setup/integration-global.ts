import { createSequelize } from '../../lib/db';
import { migrator } from '../../lib/migrator';

// Builds the integration database from nothing once per run: drop, create, migrate.
export default async function setup() {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set: run the tests through `npm test` (scripts/test.sh), which starts MariaDB.');
  const parsed = new URL(url);
  const name = parsed.pathname.slice(1);
  if (!/^brinewright_test\w*$/.test(name)) throw new Error(`Refusing to rebuild "${name}": integration tests only use databases named brinewright_test*`);
  const serverUrl = new URL(url);
  serverUrl.pathname = '/information_schema';
  const server = createSequelize(serverUrl.toString());
  await server.query(`DROP DATABASE IF EXISTS \`${name}\``);
  await server.query(`CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await server.close();
  const sequelize = createSequelize(url);
  await migrator(sequelize).up();
  await sequelize.close();
}

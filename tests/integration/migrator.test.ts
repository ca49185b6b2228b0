// The migrations and seeders run both ways on a database of this test's own (never the shared test
// database: the other integration tests use it at the same time).
import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { createSequelize } from '@/lib/db';
import { migrateAndSync, migrator, rebuildDatabase, seeder } from '@/lib/migrator';

const base = new URL(process.env.DATABASE_URL!);
const url = (() => {
  const u = new URL(base);
  u.pathname = `/${decodeURIComponent(base.pathname.slice(1))}_migrator`;
  return u.toString();
})();

const tables = async (sequelize: ReturnType<typeof createSequelize>) =>
  (
    await sequelize.query<{ name: string }>('SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() ORDER BY table_name', {
      type: QueryTypes.SELECT,
    })
  ).map((r) => r.name);

describe('migrations and seeders', () => {
  const sequelize = createSequelize(url);
  afterAll(async () => {
    await sequelize.query(`DROP DATABASE IF EXISTS \`${decodeURIComponent(new URL(url).pathname.slice(1))}\``);
    await sequelize.close();
  });

  it('revert and re-apply on one connection, as `npm run db:reset` does, with the demo data back', { timeout: 120_000 }, async () => {
    await rebuildDatabase(url, { allowed: /^brinewright_test\w*_migrator$/, purpose: 'the migrator test', seed: true });
    const applied = (await migrator(sequelize).executed()).map((m) => m.name);
    const seeded = (await seeder(sequelize).executed()).map((m) => m.name);
    expect(applied.length).toBeGreaterThan(0);
    expect(seeded.length).toBeGreaterThan(0);
    expect(applied.every((name) => !seeded.includes(name))).toBe(true);

    // The same order as scripts/migrate.ts reset, both umzug instances on the same Sequelize.
    await seeder(sequelize).down({ to: 0 });
    await migrator(sequelize).down({ to: 0 });
    expect(await tables(sequelize)).toEqual(['SequelizeData', 'SequelizeMeta']);

    await migrateAndSync(sequelize);
    await seeder(sequelize).up();
    expect((await migrator(sequelize).executed()).map((m) => m.name)).toEqual(applied);
    expect((await seeder(sequelize).executed()).map((m) => m.name)).toEqual(seeded);
    const [demo] = await sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM users WHERE email = 'learner@cedarhollow.example'", {
      type: QueryTypes.SELECT,
    });
    expect(Number(demo.n)).toBe(1);
  });
});

import { Sequelize } from 'sequelize';
import * as mariadb from 'mariadb';
import { getEnv } from './env';

declare global {
  var __brinewrightSequelize: Sequelize | undefined;
}

/** Builds a Sequelize instance for a mariadb:// or mysql:// URL. */
export function createSequelize(databaseUrl: string, options: { poolMax?: number; logging?: boolean } = {}): Sequelize {
  const url = new URL(databaseUrl);
  return new Sequelize(decodeURIComponent(url.pathname.slice(1)), decodeURIComponent(url.username), decodeURIComponent(url.password), {
    dialect: 'mariadb',
    // The driver is passed in so the bundler never has to resolve a dynamic require.
    dialectModule: mariadb,
    host: url.hostname,
    port: Number(url.port || 3306),
    logging: options.logging ? console.log : false,
    timezone: '+00:00',
    // What these mean when the database goes away (tests/e2e/db-restart.test.ts holds them):
    // - A stopped server refuses the connection at once: the query fails in milliseconds and the
    //   route answers 503 (lib/errors.ts). Sequelize does not retry connection errors.
    // - A server that accepts TCP but does not answer (starting up, overloaded) is given up after
    //   connectTimeout, so no request waits longer than that for a new connection.
    // - When every connection is busy, a request waits at most `acquire` for one, then gets a 503.
    // - Connections broken by a restart fail their `validate` check and are dropped (checked every
    //   `evict` ms and on acquire); new ones are made as soon as the server answers again, so the
    //   same process recovers without a restart.
    pool: { max: options.poolMax ?? 10, min: 0, acquire: 5_000, idle: 10_000, evict: 1_000 },
    dialectOptions: {
      connectTimeout: 3_000,
    },
    define: { underscored: false },
  });
}

/** The app's one Sequelize instance, cached on globalThis so hot reloads reuse the pool. */
export function getSequelize(): Sequelize {
  if (!globalThis.__brinewrightSequelize) {
    const env = getEnv();
    globalThis.__brinewrightSequelize = createSequelize(env.DATABASE_URL, { poolMax: env.DB_POOL_MAX });
  }
  return globalThis.__brinewrightSequelize;
}

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
    pool: { max: options.poolMax ?? 10, min: 0, acquire: 10_000, idle: 10_000 },
    dialectOptions: {
      connectTimeout: 3_000,
      // A dead server must give a quick failure, not a request that hangs.
      acquireTimeout: 3_000,
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

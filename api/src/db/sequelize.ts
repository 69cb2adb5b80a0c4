import { Sequelize } from 'sequelize';
import { getDatabasePoolMax, getDatabaseUrl } from '../config/env';

/**
 * A Sequelize instance for a PostgreSQL URL; underscored columns, no SQL logging. `poolMax`
 * connections at most (DATABASE_POOL_MAX; the API suite runs with 1 to prove no request holds
 * two connections at once).
 */
export function createSequelize(databaseUrl: string, poolMax = getDatabasePoolMax()): Sequelize {
  return new Sequelize(databaseUrl, {
    dialect: 'postgres',
    logging: false,
    define: { underscored: true },
    pool: { max: poolMax, min: 0, idle: 10_000, acquire: 10_000 },
    // A refused connection should fail the request quickly, not hang it.
    dialectOptions: { connectionTimeoutMillis: 5_000 },
  });
}

/** The process-wide connection pool; models are bound to it. It connects on first query. */
export const sequelize = createSequelize(getDatabaseUrl());

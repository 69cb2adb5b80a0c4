import type { MigrationParams } from '../umzug';

// Sign-in and password-change throttling (rate-limiter-flexible's PostgreSQL store): one row per
// key, points used and expiry in epoch milliseconds, shared by every API process.
export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.sequelize.query(`
    CREATE TABLE auth_throttle (
      key varchar(255) PRIMARY KEY,
      points integer NOT NULL DEFAULT 0,
      expire bigint
    )`);
  await qi.sequelize.query('CREATE INDEX auth_throttle_expire_idx ON auth_throttle (expire)');
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.dropTable('auth_throttle');
}

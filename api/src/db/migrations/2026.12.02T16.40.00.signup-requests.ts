import { DataTypes, Sequelize } from 'sequelize';
import type { MigrationParams } from '../umzug';

// Sign-ups waiting for their e-mailed link: the firm and owner are created only when the link is
// opened, so the sign-up answer is the same whether or not the address has an account.
export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.createTable(
      'signup_requests',
      {
        id: {
          type: DataTypes.UUID,
          primaryKey: true,
          allowNull: false,
          defaultValue: Sequelize.literal('gen_random_uuid()'),
        },
        email: { type: DataTypes.STRING(254), allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        firm_name: { type: DataTypes.STRING(160), allowNull: false },
        password_hash: { type: DataTypes.STRING(100), allowNull: false },
        // set by the mail job when it sends the link; null for an address that has an account
        token_hash: { type: DataTypes.STRING(64), allowNull: true },
        expires_at: { type: DataTypes.DATE, allowNull: false },
        used_at: { type: DataTypes.DATE, allowNull: true },
        created_at: {
          type: DataTypes.DATE,
          allowNull: false,
          defaultValue: Sequelize.literal('now()'),
        },
        updated_at: {
          type: DataTypes.DATE,
          allowNull: false,
          defaultValue: Sequelize.literal('now()'),
        },
      },
      { transaction },
    );
    await qi.sequelize.query(
      'CREATE UNIQUE INDEX signup_requests_token_hash_unique ON signup_requests (token_hash)',
      { transaction },
    );
    await qi.sequelize.query(
      'CREATE INDEX signup_requests_expires_idx ON signup_requests (expires_at)',
      { transaction },
    );
  });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.dropTable('signup_requests');
}

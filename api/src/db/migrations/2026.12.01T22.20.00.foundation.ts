import { DataTypes, Sequelize } from 'sequelize';
import type { MigrationParams } from '../umzug';

// Foundation schema: firms, members, projects, invitations, password resets and the
// rate-limit counters. Enumerations are text + CHECK (easier to extend than PG enum types).

const id = {
  type: DataTypes.UUID,
  primaryKey: true,
  allowNull: false,
  defaultValue: Sequelize.literal('gen_random_uuid()'),
};
const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: Sequelize.literal('now()') },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: Sequelize.literal('now()') },
};
const ref = (table: string, onDelete: 'CASCADE' | 'SET NULL', allowNull: boolean) => ({
  type: DataTypes.UUID,
  allowNull,
  references: { model: table, key: 'id' },
  onDelete,
  onUpdate: 'CASCADE',
});

export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    const q = (sql: string) => qi.sequelize.query(sql, { transaction });

    await qi.createTable(
      'firms',
      {
        id,
        name: { type: DataTypes.STRING(160), allowNull: false },
        plan: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'concept' },
        seats: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        brand_color: { type: DataTypes.STRING(7), allowNull: true },
        logo: { type: DataTypes.BLOB, allowNull: true },
        ...timestamps,
      },
      { transaction },
    );
    await q(
      `ALTER TABLE firms ADD CONSTRAINT firms_plan_check CHECK (plan IN ('concept', 'professional', 'firm'))`,
    );
    await q(`ALTER TABLE firms ADD CONSTRAINT firms_seats_check CHECK (seats >= 1)`);
    await q(
      `ALTER TABLE firms ADD CONSTRAINT firms_brand_color_check CHECK (brand_color ~ '^#[0-9a-fA-F]{6}$')`,
    );

    await qi.createTable(
      'users',
      {
        id,
        firm_id: ref('firms', 'CASCADE', false),
        name: { type: DataTypes.STRING(120), allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: false },
        password_hash: { type: DataTypes.STRING(100), allowNull: false },
        role: { type: DataTypes.STRING(20), allowNull: false },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        token_version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        last_login_at: { type: DataTypes.DATE, allowNull: true },
        ...timestamps,
      },
      { transaction },
    );
    await q(
      `ALTER TABLE users ADD CONSTRAINT users_role_check CHECK (role IN ('owner', 'admin', 'engineer', 'estimator', 'viewer'))`,
    );
    // E-mails are stored lowercased; the check keeps it that way whatever writes the row.
    await q(
      `ALTER TABLE users ADD CONSTRAINT users_email_lower_check CHECK (email = lower(email))`,
    );
    await q(`CREATE UNIQUE INDEX users_email_unique ON users (email)`);
    await q(`CREATE INDEX users_firm_idx ON users (firm_id)`);

    await qi.createTable(
      'projects',
      {
        id,
        firm_id: ref('firms', 'CASCADE', false),
        name: { type: DataTypes.STRING(200), allowNull: false },
        client: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
        location: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
        units: { type: DataTypes.STRING(2), allowNull: false },
        status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'draft' },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        created_by_id: ref('users', 'SET NULL', true),
        ...timestamps,
      },
      { transaction },
    );
    await q(
      `ALTER TABLE projects ADD CONSTRAINT projects_units_check CHECK (units IN ('SI', 'US'))`,
    );
    await q(
      `ALTER TABLE projects ADD CONSTRAINT projects_status_check CHECK (status IN ('draft', 'in review', 'issued', 'archived'))`,
    );
    // The default list: a firm's projects, most recently changed first (keyset-friendly).
    await q(
      `CREATE INDEX projects_firm_updated_idx ON projects (firm_id, updated_at DESC, id DESC)`,
    );

    await qi.createTable(
      'invitations',
      {
        id,
        firm_id: ref('firms', 'CASCADE', false),
        email: { type: DataTypes.STRING(254), allowNull: false },
        role: { type: DataTypes.STRING(20), allowNull: false },
        token_hash: { type: DataTypes.STRING(64), allowNull: false },
        expires_at: { type: DataTypes.DATE, allowNull: false },
        accepted_at: { type: DataTypes.DATE, allowNull: true },
        invited_by_id: ref('users', 'SET NULL', true),
        ...timestamps,
      },
      { transaction },
    );
    await q(
      `ALTER TABLE invitations ADD CONSTRAINT invitations_role_check CHECK (role IN ('admin', 'engineer', 'estimator', 'viewer'))`,
    );
    await q(`CREATE UNIQUE INDEX invitations_token_hash_unique ON invitations (token_hash)`);
    // At most one open invitation per address and firm.
    await q(
      `CREATE UNIQUE INDEX invitations_open_email_unique ON invitations (firm_id, email) WHERE accepted_at IS NULL`,
    );

    await qi.createTable(
      'password_resets',
      {
        id,
        user_id: ref('users', 'CASCADE', false),
        token_hash: { type: DataTypes.STRING(64), allowNull: false },
        expires_at: { type: DataTypes.DATE, allowNull: false },
        used_at: { type: DataTypes.DATE, allowNull: true },
        ...timestamps,
      },
      { transaction },
    );
    await q(
      `CREATE UNIQUE INDEX password_resets_token_hash_unique ON password_resets (token_hash)`,
    );
    await q(`CREATE INDEX password_resets_user_idx ON password_resets (user_id)`);

    // Fixed-window counters shared by every API process (no rate-limit state in memory).
    await qi.createTable(
      'rate_limits',
      {
        key: { type: DataTypes.STRING(300), primaryKey: true, allowNull: false },
        hits: { type: DataTypes.INTEGER, allowNull: false },
        reset_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await q(`CREATE INDEX rate_limits_reset_idx ON rate_limits (reset_at)`);
  });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    for (const table of [
      'rate_limits',
      'password_resets',
      'invitations',
      'projects',
      'users',
      'firms',
    ]) {
      await qi.dropTable(table, { transaction });
    }
  });
}

import type { MigrationParams } from '../umzug';

// Plans and brand (issue 10): the firm's billing state (written by the billing webhooks through
// applyPlanChange), the subscription's identifiers, and the brand printed on proposals. The logo
// itself stays in firms.logo (bytea, stored re-encoded and bounded by the upload route).
export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    const q = (sql: string) => qi.sequelize.query(sql, { transaction });
    await q(`ALTER TABLE firms
      ADD COLUMN billing_status text NOT NULL DEFAULT 'active'
        CONSTRAINT firms_billing_status_check CHECK (billing_status IN ('active', 'past_due', 'read_only')),
      ADD COLUMN grace_ends_at timestamptz NULL,
      ADD COLUMN stripe_customer_id text NULL CONSTRAINT firms_stripe_customer_id_key UNIQUE,
      ADD COLUMN stripe_subscription_id text NULL CONSTRAINT firms_stripe_subscription_id_key UNIQUE,
      ADD COLUMN cancel_at_period_end boolean NOT NULL DEFAULT false,
      ADD COLUMN current_period_end timestamptz NULL,
      ADD COLUMN billing_synced_at timestamptz NULL,
      ADD COLUMN logo_type text NULL
        CONSTRAINT firms_logo_type_check CHECK (logo_type IN ('image/png', 'image/jpeg')),
      ADD COLUMN logo_updated_at timestamptz NULL,
      ADD COLUMN proposal_footer text NULL
        CONSTRAINT firms_proposal_footer_check CHECK (char_length(proposal_footer) <= 500),
      ADD COLUMN seal_statement text NULL
        CONSTRAINT firms_seal_statement_check CHECK (char_length(seal_statement) <= 500)`);
  });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.sequelize.query(`ALTER TABLE firms
    DROP COLUMN seal_statement,
    DROP COLUMN proposal_footer,
    DROP COLUMN logo_updated_at,
    DROP COLUMN logo_type,
    DROP COLUMN billing_synced_at,
    DROP COLUMN current_period_end,
    DROP COLUMN cancel_at_period_end,
    DROP COLUMN stripe_subscription_id,
    DROP COLUMN stripe_customer_id,
    DROP COLUMN grace_ends_at,
    DROP COLUMN billing_status`);
}

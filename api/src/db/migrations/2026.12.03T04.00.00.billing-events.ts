import { DataTypes, Sequelize } from 'sequelize';
import type { MigrationParams } from '../umzug';

// The payment-service events already processed. Each is recorded in the same transaction as its
// effect (the primary key is the event's id), so the same event delivered again, or twice at
// once, changes nothing. The firms' billing columns are in …T03.00.00.firm-billing-brand.
export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.createTable(
      'billing_events',
      {
        id: { type: DataTypes.STRING(255), primaryKey: true, allowNull: false },
        type: { type: DataTypes.STRING(80), allowNull: false },
        firm_id: {
          type: DataTypes.UUID,
          allowNull: true,
          references: { model: 'firms', key: 'id' },
          onDelete: 'SET NULL',
        },
        // the event's `created`, seconds since 1970
        created: { type: DataTypes.BIGINT, allowNull: false },
        // what the event did: 'applied', or why it changed nothing ('stale', 'no_firm', …)
        outcome: { type: DataTypes.STRING(40), allowNull: false },
        processed_at: {
          type: DataTypes.DATE,
          allowNull: false,
          defaultValue: Sequelize.literal('now()'),
        },
      },
      { transaction },
    );
    await qi.sequelize.query('CREATE INDEX billing_events_firm_idx ON billing_events (firm_id)', {
      transaction,
    });
  });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.dropTable('billing_events');
}

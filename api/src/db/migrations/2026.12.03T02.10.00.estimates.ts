import { DataTypes, Sequelize } from 'sequelize';
import type { MigrationParams } from '../umzug';

const id = {
  type: DataTypes.UUID,
  primaryKey: true,
  allowNull: false,
  defaultValue: Sequelize.literal('gen_random_uuid()'),
};
const ref = (model: string, allowNull = false, onDelete = 'CASCADE') => ({
  type: DataTypes.UUID,
  allowNull,
  references: { model, key: 'id' },
  onDelete,
  onUpdate: 'CASCADE',
});
const at = { type: DataTypes.DATE, allowNull: false, defaultValue: Sequelize.literal('now()') };

// Take-off assumption overrides per design; estimate revisions of a project (a draft is priced
// live, an issued one keeps its lines and totals and never changes); the audit of quantity
// overrides; and each price book's remembered mapping of take-off lines to its item codes.
export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.addColumn(
      'price_books',
      'takeoff_mapping',
      { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      { transaction },
    );
    await qi.createTable(
      'design_takeoffs',
      {
        id,
        firm_id: ref('firms'),
        design_id: { ...ref('designs'), unique: true },
        overrides: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        updated_by_id: ref('users', true, 'SET NULL'),
        created_at: at,
        updated_at: at,
      },
      { transaction },
    );
    await qi.addIndex('design_takeoffs', ['firm_id'], {
      name: 'design_takeoffs_firm_id',
      transaction,
    });
    await qi.createTable(
      'estimates',
      {
        id,
        firm_id: ref('firms'),
        project_id: ref('projects'),
        revision: { type: DataTypes.INTEGER, allowNull: false },
        status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'draft' },
        price_book_id: ref('price_books', true, 'SET NULL'),
        settings: { type: DataTypes.JSONB, allowNull: false },
        quantity_overrides: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        issued_snapshot: { type: DataTypes.JSONB, allowNull: true },
        priced_from: { type: DataTypes.JSONB, allowNull: true },
        issued_at: { type: DataTypes.DATE, allowNull: true },
        issued_by_id: ref('users', true, 'SET NULL'),
        created_by_id: ref('users', true, 'SET NULL'),
        created_at: at,
        updated_at: at,
      },
      { transaction },
    );
    await qi.addIndex('estimates', ['firm_id'], { name: 'estimates_firm_id', transaction });
    await qi.addIndex('estimates', ['project_id', 'revision'], {
      name: 'estimates_project_revision',
      unique: true,
      transaction,
    });
    await qi.createTable(
      'estimate_audit_entries',
      {
        id,
        firm_id: ref('firms'),
        estimate_id: ref('estimates'),
        user_id: ref('users', true, 'SET NULL'),
        user_name: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
        takeoff_key: { type: DataTypes.STRING(80), allowNull: false },
        old_quantity: { type: DataTypes.DOUBLE, allowNull: true },
        new_quantity: { type: DataTypes.DOUBLE, allowNull: true },
        unit: { type: DataTypes.STRING(10), allowNull: false },
        reason: { type: DataTypes.TEXT, allowNull: false },
        created_at: at,
      },
      { transaction },
    );
    await qi.addIndex('estimate_audit_entries', ['firm_id'], {
      name: 'estimate_audit_entries_firm_id',
      transaction,
    });
    await qi.addIndex('estimate_audit_entries', ['estimate_id'], {
      name: 'estimate_audit_entries_estimate',
      transaction,
    });
  });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.dropTable('estimate_audit_entries');
  await qi.dropTable('estimates');
  await qi.dropTable('design_takeoffs');
  await qi.removeColumn('price_books', 'takeoff_mapping');
}

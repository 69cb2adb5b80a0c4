import { DataTypes, Sequelize } from 'sequelize';
import type { MigrationParams } from '../umzug';

// One design a project: the study input as the engineer typed it (in the project's units) and
// the options that steer the dissipator catalogue (chosen type, overrides).
export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.createTable(
      'designs',
      {
        id: {
          type: DataTypes.UUID,
          primaryKey: true,
          allowNull: false,
          defaultValue: Sequelize.literal('gen_random_uuid()'),
        },
        firm_id: {
          type: DataTypes.UUID,
          allowNull: false,
          references: { model: 'firms', key: 'id' },
          onDelete: 'CASCADE',
          onUpdate: 'CASCADE',
        },
        project_id: {
          type: DataTypes.UUID,
          allowNull: false,
          unique: true,
          references: { model: 'projects', key: 'id' },
          onDelete: 'CASCADE',
          onUpdate: 'CASCADE',
        },
        input: { type: DataTypes.JSONB, allowNull: false },
        options: { type: DataTypes.JSONB, allowNull: true },
        updated_by_id: {
          type: DataTypes.UUID,
          allowNull: true,
          references: { model: 'users', key: 'id' },
          onDelete: 'SET NULL',
          onUpdate: 'CASCADE',
        },
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
    await qi.addIndex('designs', ['firm_id'], { name: 'designs_firm_id', transaction });
  });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.dropTable('designs');
}

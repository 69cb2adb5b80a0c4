import { DataTypes, Sequelize } from 'sequelize';
import type { MigrationParams } from '../umzug';

const uuid = (model: string, onDelete: 'CASCADE' | 'SET NULL', allowNull: boolean) => ({
  type: DataTypes.UUID,
  allowNull,
  references: { model, key: 'id' },
  onDelete,
  onUpdate: 'CASCADE',
});
const now = () => ({
  type: DataTypes.DATE,
  allowNull: false,
  defaultValue: Sequelize.literal('now()'),
});

// The proposal PDF (issue 11):
// - proposals: one rendering of an issued version — its progress (queued, rendering, done,
//   failed with a message), the PDF bytes and page count once done, who asked and when;
// - proposal_emails: every time a proposal was e-mailed: to whom, by whom, when (with the
//   version it came from, so "what the client saw" is one query).
export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.createTable(
      'proposals',
      {
        id: {
          type: DataTypes.UUID,
          primaryKey: true,
          allowNull: false,
          defaultValue: Sequelize.literal('gen_random_uuid()'),
        },
        firm_id: uuid('firms', 'CASCADE', false),
        project_id: uuid('projects', 'CASCADE', false),
        version_id: uuid('design_versions', 'CASCADE', false),
        status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'queued' },
        error: { type: DataTypes.TEXT, allowNull: true },
        pages: { type: DataTypes.INTEGER, allowNull: true },
        byte_size: { type: DataTypes.INTEGER, allowNull: true },
        pdf: { type: DataTypes.BLOB, allowNull: true },
        requested_by_id: uuid('users', 'SET NULL', true),
        started_at: { type: DataTypes.DATE, allowNull: true },
        rendered_at: { type: DataTypes.DATE, allowNull: true },
        created_at: now(),
        updated_at: now(),
      },
      { transaction },
    );
    await qi.sequelize.query(
      `ALTER TABLE proposals ADD CONSTRAINT proposals_status_check
         CHECK (status IN ('queued', 'rendering', 'done', 'failed'))`,
      { transaction },
    );
    await qi.addIndex('proposals', ['firm_id'], { transaction });
    await qi.addIndex('proposals', ['project_id', 'created_at'], { transaction });
    await qi.addIndex('proposals', ['version_id'], { transaction });
    await qi.createTable(
      'proposal_emails',
      {
        id: {
          type: DataTypes.UUID,
          primaryKey: true,
          allowNull: false,
          defaultValue: Sequelize.literal('gen_random_uuid()'),
        },
        firm_id: uuid('firms', 'CASCADE', false),
        proposal_id: uuid('proposals', 'CASCADE', false),
        version_id: uuid('design_versions', 'CASCADE', false),
        recipient: { type: DataTypes.STRING(254), allowNull: false },
        subject: { type: DataTypes.STRING(300), allowNull: false },
        sent_by_id: uuid('users', 'SET NULL', true),
        sent_by_name: { type: DataTypes.STRING(120), allowNull: false },
        sent_at: now(),
      },
      { transaction },
    );
    await qi.addIndex('proposal_emails', ['firm_id'], { transaction });
    await qi.addIndex('proposal_emails', ['proposal_id'], { transaction });
    await qi.addIndex('proposal_emails', ['version_id'], { transaction });
  });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.dropTable('proposal_emails', { transaction });
    await qi.dropTable('proposals', { transaction });
  });
}

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

// Issued versions, review and sign-off, and the audit trail (issue 11):
// - designs.revision: the draft's save counter, the token of optimistic concurrency (a save
//   based on another revision is refused with 409);
// - design_versions: an issued version's immutable snapshot (input, options, the result the
//   server computed, engine version, key figures) with who issued it, when and a note, and its
//   review state (the only columns that change after issue; a trigger refuses any other change);
// - reviewer_credentials: a member marked as licensed reviewer (one row a member);
// - audit_events: every step, readable by the firm.
export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.addColumn(
      'designs',
      'revision',
      { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      { transaction },
    );
    await qi.createTable(
      'design_versions',
      {
        id: {
          type: DataTypes.UUID,
          primaryKey: true,
          allowNull: false,
          defaultValue: Sequelize.literal('gen_random_uuid()'),
        },
        firm_id: uuid('firms', 'CASCADE', false),
        project_id: uuid('projects', 'CASCADE', false),
        design_id: uuid('designs', 'CASCADE', false),
        number: { type: DataTypes.INTEGER, allowNull: false },
        design_revision: { type: DataTypes.INTEGER, allowNull: false },
        input: { type: DataTypes.JSONB, allowNull: false },
        options: { type: DataTypes.JSONB, allowNull: true },
        result: { type: DataTypes.JSONB, allowNull: false },
        engine_version: { type: DataTypes.STRING(32), allowNull: false },
        computed_at: { type: DataTypes.DATE, allowNull: false },
        figures: { type: DataTypes.JSONB, allowNull: false },
        note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        issued_by_id: uuid('users', 'SET NULL', true),
        issued_by_name: { type: DataTypes.STRING(120), allowNull: false },
        issued_at: now(),
        review_state: {
          type: DataTypes.STRING(20),
          allowNull: false,
          defaultValue: 'not_sent',
        },
        sent_by_id: uuid('users', 'SET NULL', true),
        sent_at: { type: DataTypes.DATE, allowNull: true },
        reviewed_by_id: uuid('users', 'SET NULL', true),
        reviewed_by_name: { type: DataTypes.STRING(120), allowNull: true },
        reviewed_at: { type: DataTypes.DATE, allowNull: true },
        reviewer_licence: { type: DataTypes.STRING(60), allowNull: true },
        reviewer_jurisdiction: { type: DataTypes.STRING(120), allowNull: true },
        reviewer_statement: { type: DataTypes.TEXT, allowNull: true },
        review_comments: { type: DataTypes.TEXT, allowNull: true },
        created_at: now(),
        updated_at: now(),
      },
      { transaction },
    );
    await qi.addIndex('design_versions', ['firm_id'], {
      name: 'design_versions_firm_id',
      transaction,
    });
    await qi.addIndex('design_versions', ['project_id', 'number'], {
      name: 'design_versions_project_number',
      unique: true,
      transaction,
    });
    await qi.sequelize.query(
      `ALTER TABLE design_versions ADD CONSTRAINT design_versions_review_state CHECK
         (review_state IN ('not_sent', 'in_review', 'approved', 'returned'))`,
      { transaction },
    );
    // The snapshot never changes once issued: the database refuses it too, whatever the caller.
    await qi.sequelize.query(
      `CREATE FUNCTION design_versions_immutable() RETURNS trigger LANGUAGE plpgsql AS $$
       BEGIN
         IF NEW.input IS DISTINCT FROM OLD.input OR NEW.options IS DISTINCT FROM OLD.options
            OR NEW.result IS DISTINCT FROM OLD.result
            OR NEW.engine_version IS DISTINCT FROM OLD.engine_version
            OR NEW.computed_at IS DISTINCT FROM OLD.computed_at
            OR NEW.figures IS DISTINCT FROM OLD.figures OR NEW.note IS DISTINCT FROM OLD.note
            OR NEW.number IS DISTINCT FROM OLD.number
            OR NEW.design_revision IS DISTINCT FROM OLD.design_revision
            OR NEW.issued_by_name IS DISTINCT FROM OLD.issued_by_name
            OR NEW.issued_at IS DISTINCT FROM OLD.issued_at
            OR NEW.firm_id IS DISTINCT FROM OLD.firm_id
            OR NEW.project_id IS DISTINCT FROM OLD.project_id THEN
           RAISE EXCEPTION 'an issued version cannot change' USING ERRCODE = 'check_violation';
         END IF;
         RETURN NEW;
       END $$`,
      { transaction },
    );
    await qi.sequelize.query(
      `CREATE TRIGGER design_versions_immutable BEFORE UPDATE ON design_versions
       FOR EACH ROW EXECUTE FUNCTION design_versions_immutable()`,
      { transaction },
    );
    await qi.createTable(
      'reviewer_credentials',
      {
        user_id: {
          ...uuid('users', 'CASCADE', false),
          primaryKey: true,
        },
        firm_id: uuid('firms', 'CASCADE', false),
        licence_number: { type: DataTypes.STRING(60), allowNull: false },
        jurisdiction: { type: DataTypes.STRING(120), allowNull: false },
        statement: { type: DataTypes.TEXT, allowNull: false },
        marked_by_id: uuid('users', 'SET NULL', true),
        created_at: now(),
        updated_at: now(),
      },
      { transaction },
    );
    await qi.addIndex('reviewer_credentials', ['firm_id'], {
      name: 'reviewer_credentials_firm_id',
      transaction,
    });
    await qi.createTable(
      'audit_events',
      {
        id: {
          type: DataTypes.UUID,
          primaryKey: true,
          allowNull: false,
          defaultValue: Sequelize.literal('gen_random_uuid()'),
        },
        firm_id: uuid('firms', 'CASCADE', false),
        project_id: uuid('projects', 'SET NULL', true),
        version_id: uuid('design_versions', 'SET NULL', true),
        actor_id: uuid('users', 'SET NULL', true),
        actor_name: { type: DataTypes.STRING(120), allowNull: false },
        action: { type: DataTypes.STRING(40), allowNull: false },
        summary: { type: DataTypes.TEXT, allowNull: false },
        detail: { type: DataTypes.JSONB, allowNull: true },
        created_at: now(),
      },
      { transaction },
    );
    await qi.addIndex('audit_events', ['firm_id', 'created_at'], {
      name: 'audit_events_firm_created',
      transaction,
    });
    await qi.addIndex('audit_events', ['project_id', 'created_at'], {
      name: 'audit_events_project_created',
      transaction,
    });
  });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.dropTable('audit_events', { transaction });
    await qi.dropTable('reviewer_credentials', { transaction });
    await qi.dropTable('design_versions', { transaction });
    await qi.sequelize.query('DROP FUNCTION IF EXISTS design_versions_immutable()', {
      transaction,
    });
    await qi.removeColumn('designs', 'revision', { transaction });
  });
}

import { DataTypes } from 'sequelize';
import type { MigrationParams } from '../umzug';

// The study result the server computes on save, kept with the design: the result (JSON, SI),
// the engine version that computed it and when. Designs saved before stay without one (null)
// until they are saved again.
export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.addColumn(
      'designs',
      'result',
      { type: DataTypes.JSONB, allowNull: true },
      { transaction },
    );
    await qi.addColumn(
      'designs',
      'engine_version',
      { type: DataTypes.STRING(32), allowNull: true },
      { transaction },
    );
    await qi.addColumn(
      'designs',
      'computed_at',
      { type: DataTypes.DATE, allowNull: true },
      { transaction },
    );
  });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.removeColumn('designs', 'computed_at', { transaction });
    await qi.removeColumn('designs', 'engine_version', { transaction });
    await qi.removeColumn('designs', 'result', { transaction });
  });
}

import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { StudyInput, StudyResult } from '@basinwright/common';
import type { User } from './User';

/**
 * A project's design: the study input in the project's units, and the study result the server
 * computed from it on save (SI), with the engine version and time (tenant-owned). Designs saved
 * before results were kept have none.
 */
export class Design extends Model<InferAttributes<Design>, InferCreationAttributes<Design>> {
  declare id: CreationOptional<string>;
  declare firmId: string;
  declare projectId: string;
  declare input: StudyInput;
  declare options: Record<string, unknown> | null;
  declare updatedById: string | null;
  declare result: CreationOptional<StudyResult | null>;
  declare engineVersion: CreationOptional<string | null>;
  declare computedAt: CreationOptional<Date | null>;
  /** the draft's save counter: the optimistic-concurrency token (a save must send the one it read) */
  declare revision: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare updatedBy?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize): typeof Design {
    Design.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        firmId: { type: DataTypes.UUID, allowNull: false },
        projectId: { type: DataTypes.UUID, allowNull: false, unique: true },
        input: { type: DataTypes.JSONB, allowNull: false },
        options: { type: DataTypes.JSONB, allowNull: true },
        updatedById: { type: DataTypes.UUID, allowNull: true },
        result: { type: DataTypes.JSONB, allowNull: true },
        engineVersion: { type: DataTypes.STRING(32), allowNull: true },
        computedAt: { type: DataTypes.DATE, allowNull: true },
        revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'designs', modelName: 'Design' },
    );
    return Design;
  }
}

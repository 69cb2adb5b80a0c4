import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { AUDIT_ACTIONS, type AuditAction } from '@basinwright/common';

/** One step in the firm's audit trail (tenant-owned; written, never changed). */
export class AuditEvent extends Model<
  InferAttributes<AuditEvent>,
  InferCreationAttributes<AuditEvent>
> {
  declare id: CreationOptional<string>;
  declare firmId: string;
  declare projectId: string | null;
  declare versionId: string | null;
  declare actorId: string | null;
  declare actorName: string;
  declare action: AuditAction;
  /** a plain sentence of what happened */
  declare summary: string;
  declare detail: Record<string, unknown> | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof AuditEvent {
    AuditEvent.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        firmId: { type: DataTypes.UUID, allowNull: false },
        projectId: { type: DataTypes.UUID, allowNull: true },
        versionId: { type: DataTypes.UUID, allowNull: true },
        actorId: { type: DataTypes.UUID, allowNull: true },
        actorName: { type: DataTypes.STRING(120), allowNull: false },
        action: {
          type: DataTypes.STRING(40),
          allowNull: false,
          validate: { isIn: [[...AUDIT_ACTIONS]] },
        },
        summary: { type: DataTypes.TEXT, allowNull: false },
        detail: { type: DataTypes.JSONB, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      {
        sequelize,
        tableName: 'audit_events',
        modelName: 'AuditEvent',
        updatedAt: false,
      },
    );
    return AuditEvent;
  }
}

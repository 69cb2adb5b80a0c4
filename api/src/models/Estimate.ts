import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { EstimateSettings } from '@basinwright/common';

/** What an issued revision was priced from: the design and its stored result. */
export interface PricedFrom {
  designId: string;
  engineVersion: string | null;
  computedAt: string | null;
  designUpdatedAt: string;
  priceBookId: string;
  priceBookName: string;
}

/** A quantity the estimator set instead of the take-off's (SI), with the reason. */
export type QuantityOverrides = Record<string, { quantity: number; reason: string }>;

/**
 * One revision of a project's estimate (tenant-owned). A draft is priced on read from the
 * stored design result; an issued revision holds its lines and totals in `issuedSnapshot` and
 * never changes again.
 */
export class Estimate extends Model<InferAttributes<Estimate>, InferCreationAttributes<Estimate>> {
  declare id: CreationOptional<string>;
  declare firmId: string;
  declare projectId: string;
  declare revision: number;
  declare status: CreationOptional<'draft' | 'issued'>;
  declare priceBookId: string | null;
  declare settings: EstimateSettings;
  declare quantityOverrides: CreationOptional<QuantityOverrides>;
  declare issuedSnapshot: CreationOptional<Record<string, unknown> | null>;
  declare pricedFrom: CreationOptional<PricedFrom | null>;
  declare issuedAt: CreationOptional<Date | null>;
  declare issuedById: CreationOptional<string | null>;
  declare createdById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof Estimate {
    Estimate.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        firmId: { type: DataTypes.UUID, allowNull: false },
        projectId: { type: DataTypes.UUID, allowNull: false },
        revision: { type: DataTypes.INTEGER, allowNull: false },
        status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'draft' },
        priceBookId: { type: DataTypes.UUID, allowNull: true },
        settings: { type: DataTypes.JSONB, allowNull: false },
        quantityOverrides: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        issuedSnapshot: { type: DataTypes.JSONB, allowNull: true },
        pricedFrom: { type: DataTypes.JSONB, allowNull: true },
        issuedAt: { type: DataTypes.DATE, allowNull: true },
        issuedById: { type: DataTypes.UUID, allowNull: true },
        createdById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'estimates', modelName: 'Estimate' },
    );
    return Estimate;
  }
}

/** Who changed which quantity of an estimate, when, from what to what and why (SI). */
export class EstimateAuditEntry extends Model<
  InferAttributes<EstimateAuditEntry>,
  InferCreationAttributes<EstimateAuditEntry>
> {
  declare id: CreationOptional<string>;
  declare firmId: string;
  declare estimateId: string;
  declare userId: string | null;
  declare userName: string;
  declare takeoffKey: string;
  declare oldQuantity: number | null;
  declare newQuantity: number | null;
  declare unit: string;
  declare reason: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof EstimateAuditEntry {
    EstimateAuditEntry.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        firmId: { type: DataTypes.UUID, allowNull: false },
        estimateId: { type: DataTypes.UUID, allowNull: false },
        userId: { type: DataTypes.UUID, allowNull: true },
        userName: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
        takeoffKey: { type: DataTypes.STRING(80), allowNull: false },
        oldQuantity: { type: DataTypes.DOUBLE, allowNull: true },
        newQuantity: { type: DataTypes.DOUBLE, allowNull: true },
        unit: { type: DataTypes.STRING(10), allowNull: false },
        reason: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      {
        sequelize,
        tableName: 'estimate_audit_entries',
        modelName: 'EstimateAuditEntry',
        updatedAt: false,
      },
    );
    return EstimateAuditEntry;
  }
}

/** A design's take-off assumption overrides (SI), kept apart from its hydraulics. */
export class DesignTakeoff extends Model<
  InferAttributes<DesignTakeoff>,
  InferCreationAttributes<DesignTakeoff>
> {
  declare id: CreationOptional<string>;
  declare firmId: string;
  declare designId: string;
  declare overrides: Record<string, unknown>;
  declare updatedById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof DesignTakeoff {
    DesignTakeoff.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        firmId: { type: DataTypes.UUID, allowNull: false },
        designId: { type: DataTypes.UUID, allowNull: false, unique: true },
        overrides: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        updatedById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'design_takeoffs', modelName: 'DesignTakeoff' },
    );
    return DesignTakeoff;
  }
}

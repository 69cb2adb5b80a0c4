import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/**
 * A payment-service event already processed, recorded in the same transaction as its effect:
 * its id is the primary key, so the same event delivered again (or twice at once) changes nothing.
 */
export class BillingEvent extends Model<
  InferAttributes<BillingEvent>,
  InferCreationAttributes<BillingEvent>
> {
  declare id: string;
  declare type: string;
  declare firmId: string | null;
  /** the event's `created`, seconds since 1970 (BIGINT: read back as a string) */
  declare created: number | string;
  /** 'applied', or why the event changed nothing ('stale', 'no_firm', 'ignored') */
  declare outcome: string;
  declare processedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof BillingEvent {
    BillingEvent.init(
      {
        id: { type: DataTypes.STRING(255), primaryKey: true },
        type: { type: DataTypes.STRING(80), allowNull: false },
        firmId: { type: DataTypes.UUID, allowNull: true },
        created: { type: DataTypes.BIGINT, allowNull: false },
        outcome: { type: DataTypes.STRING(40), allowNull: false },
        processedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      { sequelize, tableName: 'billing_events', modelName: 'BillingEvent', timestamps: false },
    );
    return BillingEvent;
  }
}

import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { BILLING_STATUSES, PLANS, type BillingStatus, type Plan } from '@basinwright/common';

/** A tenant: every member and project belongs to exactly one firm. */
export class Firm extends Model<InferAttributes<Firm>, InferCreationAttributes<Firm>> {
  declare id: CreationOptional<string>;
  declare name: string;
  declare plan: CreationOptional<Plan>;
  declare seats: CreationOptional<number>;
  declare brandColor: CreationOptional<string | null>;
  declare logo: CreationOptional<Buffer | null>;
  /** The logo's content type, as read from its bytes ('image/png' or 'image/jpeg'). */
  declare logoType: CreationOptional<'image/png' | 'image/jpeg' | null>;
  declare logoUpdatedAt: CreationOptional<Date | null>;
  /** Text printed at the foot of every proposal page (paid plans). */
  declare proposalFooter: CreationOptional<string | null>;
  /** The licence or seal statement printed on proposals. */
  declare sealStatement: CreationOptional<string | null>;
  /** 'active'; 'past_due' (grace until graceEndsAt); 'read_only' (writes refused, all readable). */
  declare billingStatus: CreationOptional<BillingStatus>;
  declare graceEndsAt: CreationOptional<Date | null>;
  declare stripeCustomerId: CreationOptional<string | null>;
  declare stripeSubscriptionId: CreationOptional<string | null>;
  declare cancelAtPeriodEnd: CreationOptional<boolean>;
  declare currentPeriodEnd: CreationOptional<Date | null>;
  /** When the newest subscription state applied was made (older states are ignored). */
  declare billingSyncedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof Firm {
    Firm.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        name: { type: DataTypes.STRING(160), allowNull: false },
        plan: {
          type: DataTypes.STRING(20),
          allowNull: false,
          defaultValue: 'concept',
          validate: { isIn: [[...PLANS]] },
        },
        seats: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1, validate: { min: 1 } },
        brandColor: { type: DataTypes.STRING(7), allowNull: true, defaultValue: null },
        logo: { type: DataTypes.BLOB, allowNull: true, defaultValue: null },
        logoType: { type: DataTypes.TEXT, allowNull: true, defaultValue: null },
        logoUpdatedAt: { type: DataTypes.DATE, allowNull: true, defaultValue: null },
        proposalFooter: { type: DataTypes.TEXT, allowNull: true, defaultValue: null },
        sealStatement: { type: DataTypes.TEXT, allowNull: true, defaultValue: null },
        billingStatus: {
          type: DataTypes.TEXT,
          allowNull: false,
          defaultValue: 'active',
          validate: { isIn: [[...BILLING_STATUSES]] },
        },
        graceEndsAt: { type: DataTypes.DATE, allowNull: true, defaultValue: null },
        stripeCustomerId: { type: DataTypes.TEXT, allowNull: true, defaultValue: null },
        stripeSubscriptionId: { type: DataTypes.TEXT, allowNull: true, defaultValue: null },
        cancelAtPeriodEnd: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        currentPeriodEnd: { type: DataTypes.DATE, allowNull: true, defaultValue: null },
        billingSyncedAt: { type: DataTypes.DATE, allowNull: true, defaultValue: null },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'firms', modelName: 'Firm' },
    );
    return Firm;
  }
}

import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { INVITABLE_ROLES, type InvitableRole } from '@basinwright/common';
import type { Firm } from './Firm';
import type { User } from './User';

/** An e-mailed invitation to join a firm; only the sha256 of its token is stored. */
export class Invitation extends Model<
  InferAttributes<Invitation>,
  InferCreationAttributes<Invitation>
> {
  declare id: CreationOptional<string>;
  declare firmId: string;
  declare email: string;
  declare role: InvitableRole;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare acceptedAt: CreationOptional<Date | null>;
  declare invitedById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare firm?: NonAttribute<Firm>;
  declare invitedBy?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize): typeof Invitation {
    Invitation.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        firmId: { type: DataTypes.UUID, allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: false },
        role: {
          type: DataTypes.STRING(20),
          allowNull: false,
          validate: { isIn: [[...INVITABLE_ROLES]] },
        },
        tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        acceptedAt: { type: DataTypes.DATE, allowNull: true, defaultValue: null },
        invitedById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'invitations', modelName: 'Invitation' },
    );
    return Invitation;
  }
}

import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { PLANS, type Plan } from '@basinwright/common';

/** A tenant: every member and project belongs to exactly one firm. */
export class Firm extends Model<InferAttributes<Firm>, InferCreationAttributes<Firm>> {
  declare id: CreationOptional<string>;
  declare name: string;
  declare plan: CreationOptional<Plan>;
  declare seats: CreationOptional<number>;
  declare brandColor: CreationOptional<string | null>;
  declare logo: CreationOptional<Buffer | null>;
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
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'firms', modelName: 'Firm' },
    );
    return Firm;
  }
}

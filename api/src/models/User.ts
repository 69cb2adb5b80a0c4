import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { ROLES, type Role } from '@basinwright/common';
import type { Firm } from './Firm';

/** A member of a firm. E-mail is globally unique and stored lowercased. */
export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<string>;
  declare firmId: string;
  declare name: string;
  declare email: string;
  declare passwordHash: string;
  declare role: Role;
  declare active: CreationOptional<boolean>;
  /** Bumped to revoke every token issued before (logout, password reset). */
  declare tokenVersion: CreationOptional<number>;
  declare lastLoginAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare firm?: NonAttribute<Firm>;

  static initModel(sequelize: Sequelize): typeof User {
    User.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        firmId: { type: DataTypes.UUID, allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        email: {
          type: DataTypes.STRING(254),
          allowNull: false,
          unique: true,
          set(value: string) {
            this.setDataValue('email', value.trim().toLowerCase());
          },
        },
        passwordHash: { type: DataTypes.STRING(100), allowNull: false },
        role: { type: DataTypes.STRING(20), allowNull: false, validate: { isIn: [[...ROLES]] } },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        tokenVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        lastLoginAt: { type: DataTypes.DATE, allowNull: true, defaultValue: null },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'users', modelName: 'User' },
    );
    return User;
  }
}

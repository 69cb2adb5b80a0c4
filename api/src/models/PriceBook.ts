import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { PriceBookItem } from './PriceBookItem';
import type { User } from './User';

/** A firm's price book (tenant-owned): archived, never deleted. */
export class PriceBook extends Model<
  InferAttributes<PriceBook>,
  InferCreationAttributes<PriceBook>
> {
  declare id: CreationOptional<string>;
  declare firmId: string;
  declare name: string;
  declare currency: CreationOptional<string>;
  declare notes: CreationOptional<string>;
  declare archivedAt: CreationOptional<Date | null>;
  /** The remembered mapping of take-off line keys to this book's item codes. */
  declare takeoffMapping: CreationOptional<Record<string, string>>;
  declare createdById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare createdBy?: NonAttribute<User | null>;
  declare items?: NonAttribute<PriceBookItem[]>;

  static initModel(sequelize: Sequelize): typeof PriceBook {
    PriceBook.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        firmId: { type: DataTypes.UUID, allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        currency: { type: DataTypes.STRING(3), allowNull: false, defaultValue: 'USD' },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        archivedAt: { type: DataTypes.DATE, allowNull: true },
        takeoffMapping: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        createdById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'price_books', modelName: 'PriceBook' },
    );
    return PriceBook;
  }
}

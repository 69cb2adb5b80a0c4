import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/**
 * One unit rate of a price book (tenant-owned). `unitPrice` is NUMERIC in the database and
 * arrives from the driver as a decimal string; the presenter turns it into a number.
 */
export class PriceBookItem extends Model<
  InferAttributes<PriceBookItem>,
  InferCreationAttributes<PriceBookItem>
> {
  declare id: CreationOptional<string>;
  declare firmId: string;
  declare priceBookId: string;
  declare code: string;
  declare description: string;
  declare unit: string;
  declare unitPrice: number | string;
  declare currency: string;
  declare source: CreationOptional<string>;
  declare dateNote: CreationOptional<string>;
  declare position: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof PriceBookItem {
    PriceBookItem.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        firmId: { type: DataTypes.UUID, allowNull: false },
        priceBookId: { type: DataTypes.UUID, allowNull: false },
        code: { type: DataTypes.STRING(40), allowNull: false },
        description: { type: DataTypes.STRING(300), allowNull: false },
        unit: { type: DataTypes.STRING(20), allowNull: false },
        unitPrice: { type: DataTypes.DECIMAL(18, 4), allowNull: false },
        currency: { type: DataTypes.STRING(3), allowNull: false },
        source: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
        dateNote: { type: DataTypes.STRING(60), allowNull: false, defaultValue: '' },
        position: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'price_book_items', modelName: 'PriceBookItem' },
    );
    return PriceBookItem;
  }
}

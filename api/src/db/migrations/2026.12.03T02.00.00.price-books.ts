import { DataTypes, Sequelize } from 'sequelize';
import type { MigrationParams } from '../umzug';

const id = {
  type: DataTypes.UUID,
  primaryKey: true,
  allowNull: false,
  defaultValue: Sequelize.literal('gen_random_uuid()'),
};
const firmId = {
  type: DataTypes.UUID,
  allowNull: false,
  references: { model: 'firms', key: 'id' },
  onDelete: 'CASCADE',
  onUpdate: 'CASCADE',
};
const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: Sequelize.literal('now()') },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: Sequelize.literal('now()') },
};

// A firm's price books (several a firm, archived rather than deleted) and their items: unit
// rates with a code unique in the book, a unit, a price, a currency and where the rate came from.
export async function up({ context: qi }: MigrationParams): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.createTable(
      'price_books',
      {
        id,
        firm_id: firmId,
        name: { type: DataTypes.STRING(120), allowNull: false },
        currency: { type: DataTypes.STRING(3), allowNull: false, defaultValue: 'USD' },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        archived_at: { type: DataTypes.DATE, allowNull: true },
        created_by_id: {
          type: DataTypes.UUID,
          allowNull: true,
          references: { model: 'users', key: 'id' },
          onDelete: 'SET NULL',
          onUpdate: 'CASCADE',
        },
        ...timestamps,
      },
      { transaction },
    );
    await qi.addIndex('price_books', ['firm_id'], { name: 'price_books_firm_id', transaction });
    await qi.createTable(
      'price_book_items',
      {
        id,
        firm_id: firmId,
        price_book_id: {
          type: DataTypes.UUID,
          allowNull: false,
          references: { model: 'price_books', key: 'id' },
          onDelete: 'CASCADE',
          onUpdate: 'CASCADE',
        },
        code: { type: DataTypes.STRING(40), allowNull: false },
        description: { type: DataTypes.STRING(300), allowNull: false },
        unit: { type: DataTypes.STRING(20), allowNull: false },
        unit_price: { type: DataTypes.DECIMAL(18, 4), allowNull: false },
        currency: { type: DataTypes.STRING(3), allowNull: false },
        source: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
        date_note: { type: DataTypes.STRING(60), allowNull: false, defaultValue: '' },
        position: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        ...timestamps,
      },
      { transaction },
    );
    await qi.addIndex('price_book_items', ['firm_id'], {
      name: 'price_book_items_firm_id',
      transaction,
    });
    // Codes are unique in a book whatever their case (an estimate maps to a code).
    await qi.sequelize.query(
      'CREATE UNIQUE INDEX price_book_items_book_code ON price_book_items (price_book_id, lower(code))',
      { transaction },
    );
  });
}

export async function down({ context: qi }: MigrationParams): Promise<void> {
  await qi.dropTable('price_book_items');
  await qi.dropTable('price_books');
}

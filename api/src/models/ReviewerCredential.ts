import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** A member marked as licensed reviewer by an owner or admin (one row a member; tenant-owned). */
export class ReviewerCredential extends Model<
  InferAttributes<ReviewerCredential>,
  InferCreationAttributes<ReviewerCredential>
> {
  declare userId: string;
  declare firmId: string;
  declare licenceNumber: string;
  declare jurisdiction: string;
  /** the statement printed with the reviewer's signature */
  declare statement: string;
  declare markedById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof ReviewerCredential {
    ReviewerCredential.init(
      {
        userId: { type: DataTypes.UUID, primaryKey: true },
        firmId: { type: DataTypes.UUID, allowNull: false },
        licenceNumber: { type: DataTypes.STRING(60), allowNull: false },
        jurisdiction: { type: DataTypes.STRING(120), allowNull: false },
        statement: { type: DataTypes.TEXT, allowNull: false },
        markedById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'reviewer_credentials', modelName: 'ReviewerCredential' },
    );
    return ReviewerCredential;
  }
}

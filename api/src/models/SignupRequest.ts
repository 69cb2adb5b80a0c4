import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/**
 * A sign-up waiting for its e-mailed link. Only the sha256 of the link's token is stored, set
 * by the mail job; an address that already has an account never gets one.
 */
export class SignupRequest extends Model<
  InferAttributes<SignupRequest>,
  InferCreationAttributes<SignupRequest>
> {
  declare id: CreationOptional<string>;
  declare email: string;
  declare name: string;
  declare firmName: string;
  declare passwordHash: string;
  declare tokenHash: CreationOptional<string | null>;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof SignupRequest {
    SignupRequest.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        email: {
          type: DataTypes.STRING(254),
          allowNull: false,
          set(value: string) {
            this.setDataValue('email', value.trim().toLowerCase());
          },
        },
        name: { type: DataTypes.STRING(120), allowNull: false },
        firmName: { type: DataTypes.STRING(160), allowNull: false },
        passwordHash: { type: DataTypes.STRING(100), allowNull: false },
        tokenHash: { type: DataTypes.STRING(64), allowNull: true, defaultValue: null },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        usedAt: { type: DataTypes.DATE, allowNull: true, defaultValue: null },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'signup_requests', modelName: 'SignupRequest' },
    );
    return SignupRequest;
  }
}

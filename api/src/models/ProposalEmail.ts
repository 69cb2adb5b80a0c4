import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** A proposal e-mailed: to whom, by whom, when, with the issued version it came from. */
export class ProposalEmail extends Model<
  InferAttributes<ProposalEmail>,
  InferCreationAttributes<ProposalEmail>
> {
  declare id: CreationOptional<string>;
  declare firmId: string;
  declare proposalId: string;
  declare versionId: string;
  declare recipient: string;
  declare subject: string;
  declare sentById: string | null;
  declare sentByName: string;
  declare sentAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof ProposalEmail {
    ProposalEmail.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        firmId: { type: DataTypes.UUID, allowNull: false },
        proposalId: { type: DataTypes.UUID, allowNull: false },
        versionId: { type: DataTypes.UUID, allowNull: false },
        recipient: { type: DataTypes.STRING(254), allowNull: false },
        subject: { type: DataTypes.STRING(300), allowNull: false },
        sentById: { type: DataTypes.UUID, allowNull: true },
        sentByName: { type: DataTypes.STRING(120), allowNull: false },
        sentAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      { sequelize, tableName: 'proposal_emails', modelName: 'ProposalEmail', timestamps: false },
    );
    return ProposalEmail;
  }
}

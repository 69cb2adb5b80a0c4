import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { PROPOSAL_STATUSES, type ProposalStatus } from '@basinwright/common';
import type { ProposalEmail } from './ProposalEmail';

/**
 * One rendering of an issued version as a proposal PDF (tenant-owned): its progress, and the
 * PDF with its page count once done. The bytes are read only by the download route.
 */
export class Proposal extends Model<InferAttributes<Proposal>, InferCreationAttributes<Proposal>> {
  declare id: CreationOptional<string>;
  declare firmId: string;
  declare projectId: string;
  declare versionId: string;
  declare status: CreationOptional<ProposalStatus>;
  declare error: CreationOptional<string | null>;
  declare pages: CreationOptional<number | null>;
  declare byteSize: CreationOptional<number | null>;
  declare pdf: CreationOptional<Buffer | null>;
  declare requestedById: string | null;
  declare startedAt: CreationOptional<Date | null>;
  declare renderedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare emails?: NonAttribute<ProposalEmail[]>;

  static initModel(sequelize: Sequelize): typeof Proposal {
    Proposal.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        firmId: { type: DataTypes.UUID, allowNull: false },
        projectId: { type: DataTypes.UUID, allowNull: false },
        versionId: { type: DataTypes.UUID, allowNull: false },
        status: {
          type: DataTypes.STRING(12),
          allowNull: false,
          defaultValue: 'queued',
          validate: { isIn: [[...PROPOSAL_STATUSES]] },
        },
        error: { type: DataTypes.TEXT, allowNull: true, defaultValue: null },
        pages: { type: DataTypes.INTEGER, allowNull: true, defaultValue: null },
        byteSize: { type: DataTypes.INTEGER, allowNull: true, defaultValue: null },
        pdf: { type: DataTypes.BLOB, allowNull: true, defaultValue: null },
        requestedById: { type: DataTypes.UUID, allowNull: true },
        startedAt: { type: DataTypes.DATE, allowNull: true, defaultValue: null },
        renderedAt: { type: DataTypes.DATE, allowNull: true, defaultValue: null },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      {
        sequelize,
        tableName: 'proposals',
        modelName: 'Proposal',
        // the PDF bytes are read by the download route only
        defaultScope: { attributes: { exclude: ['pdf'] } },
      },
    );
    return Proposal;
  }
}

import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import {
  REVIEW_STATES,
  type ReviewState,
  type StudyInput,
  type StudyResult,
  type VersionFigures,
} from '@basinwright/common';

/**
 * An issued version of a project's design (tenant-owned): an immutable snapshot of the draft's
 * input and options, the result the server computed from them (SI) with the engine version and
 * time, the key figures, who issued it, when and a note. Only the review columns change after
 * issue; a database trigger refuses a change to anything else.
 */
export class DesignVersion extends Model<
  InferAttributes<DesignVersion>,
  InferCreationAttributes<DesignVersion>
> {
  declare id: CreationOptional<string>;
  declare firmId: string;
  declare projectId: string;
  declare designId: string;
  /** 1, 2, 3… within the project */
  declare number: number;
  /** the draft's revision the snapshot was taken from */
  declare designRevision: number;
  declare input: StudyInput;
  declare options: Record<string, unknown> | null;
  declare result: StudyResult;
  declare engineVersion: string;
  declare computedAt: Date;
  declare figures: VersionFigures;
  declare note: CreationOptional<string>;
  declare issuedById: string | null;
  /** kept as written at issue, so the record reads the same if the member leaves */
  declare issuedByName: string;
  declare issuedAt: CreationOptional<Date>;
  declare reviewState: CreationOptional<ReviewState>;
  declare sentById: CreationOptional<string | null>;
  declare sentAt: CreationOptional<Date | null>;
  declare reviewedById: CreationOptional<string | null>;
  declare reviewedByName: CreationOptional<string | null>;
  declare reviewedAt: CreationOptional<Date | null>;
  /** copied from the reviewer's credentials at the decision */
  declare reviewerLicence: CreationOptional<string | null>;
  declare reviewerJurisdiction: CreationOptional<string | null>;
  declare reviewerStatement: CreationOptional<string | null>;
  declare reviewComments: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof DesignVersion {
    DesignVersion.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        firmId: { type: DataTypes.UUID, allowNull: false },
        projectId: { type: DataTypes.UUID, allowNull: false },
        designId: { type: DataTypes.UUID, allowNull: false },
        number: { type: DataTypes.INTEGER, allowNull: false },
        designRevision: { type: DataTypes.INTEGER, allowNull: false },
        input: { type: DataTypes.JSONB, allowNull: false },
        options: { type: DataTypes.JSONB, allowNull: true },
        result: { type: DataTypes.JSONB, allowNull: false },
        engineVersion: { type: DataTypes.STRING(32), allowNull: false },
        computedAt: { type: DataTypes.DATE, allowNull: false },
        figures: { type: DataTypes.JSONB, allowNull: false },
        note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        issuedById: { type: DataTypes.UUID, allowNull: true },
        issuedByName: { type: DataTypes.STRING(120), allowNull: false },
        issuedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        reviewState: {
          type: DataTypes.STRING(20),
          allowNull: false,
          defaultValue: 'not_sent',
          validate: { isIn: [[...REVIEW_STATES]] },
        },
        sentById: { type: DataTypes.UUID, allowNull: true },
        sentAt: { type: DataTypes.DATE, allowNull: true },
        reviewedById: { type: DataTypes.UUID, allowNull: true },
        reviewedByName: { type: DataTypes.STRING(120), allowNull: true },
        reviewedAt: { type: DataTypes.DATE, allowNull: true },
        reviewerLicence: { type: DataTypes.STRING(60), allowNull: true },
        reviewerJurisdiction: { type: DataTypes.STRING(120), allowNull: true },
        reviewerStatement: { type: DataTypes.TEXT, allowNull: true },
        reviewComments: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'design_versions', modelName: 'DesignVersion' },
    );
    return DesignVersion;
  }
}

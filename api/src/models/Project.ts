import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import {
  PROJECT_STATUSES,
  PROJECT_UNITS,
  type ProjectStatus,
  type ProjectUnits,
} from '@basinwright/common';
import type { User } from './User';

/** A firm's project (tenant-owned: every query is scoped by firmId). */
export class Project extends Model<InferAttributes<Project>, InferCreationAttributes<Project>> {
  declare id: CreationOptional<string>;
  declare firmId: string;
  declare name: string;
  declare client: CreationOptional<string>;
  declare location: CreationOptional<string>;
  declare units: ProjectUnits;
  declare status: CreationOptional<ProjectStatus>;
  declare notes: CreationOptional<string>;
  declare createdById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare createdBy?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize): typeof Project {
    Project.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        firmId: { type: DataTypes.UUID, allowNull: false },
        name: { type: DataTypes.STRING(200), allowNull: false },
        client: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
        location: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
        units: {
          type: DataTypes.STRING(2),
          allowNull: false,
          validate: { isIn: [[...PROJECT_UNITS]] },
        },
        status: {
          type: DataTypes.STRING(20),
          allowNull: false,
          defaultValue: 'draft',
          validate: { isIn: [[...PROJECT_STATUSES]] },
        },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        createdById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'projects', modelName: 'Project' },
    );
    return Project;
  }
}

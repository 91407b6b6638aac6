import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { LoadCase } from '../../../shared/schemas/evaluate';
import type { DesignRecordContent, ShortlistRoundDto, ShortlistStatus, ShortlistSubmission } from '../../../shared/schemas/projects';
import type { Role } from '../../../shared/schemas/auth';
import { PropertySet, User } from './index';
import { lockVersionColumn, serialId, stamp, timestamps } from './columns';

export class Project extends Model<InferAttributes<Project>, InferCreationAttributes<Project>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare description: string;
  declare ownerId: number;
  declare lockVersion: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare owner?: NonAttribute<User>;
  declare members?: NonAttribute<User[]>;
}

export class ProjectMember extends Model<InferAttributes<ProjectMember>, InferCreationAttributes<ProjectMember>> {
  declare projectId: number;
  declare userId: number;
  declare addedById: number | null;
  declare createdAt: CreationOptional<Date>;
}

export class LoadCaseRecord extends Model<InferAttributes<LoadCaseRecord>, InferCreationAttributes<LoadCaseRecord>> {
  declare id: CreationOptional<number>;
  declare projectId: number;
  declare name: string;
  declare loadCase: LoadCase;
  declare filters: Record<string, unknown> | null;
  declare notes: string;
  declare createdById: number | null;
  declare lockVersion: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare createdBy?: NonAttribute<User | null>;
}

export class Shortlist extends Model<InferAttributes<Shortlist>, InferCreationAttributes<Shortlist>> {
  declare id: CreationOptional<number>;
  declare projectId: number;
  declare loadCaseId: number;
  declare name: string;
  declare status: CreationOptional<ShortlistStatus>;
  declare authorId: number;
  declare checkerId: number | null;
  declare submittedAt: Date | null;
  declare checkedAt: Date | null;
  declare returnedComment: string | null;
  declare checkComment: string | null;
  /** What the current submission froze; null while open or returned. */
  declare submission: CreationOptional<ShortlistSubmission | null>;
  /** Every round of submit → return or check, oldest first. */
  declare rounds: CreationOptional<ShortlistRoundDto[]>;
  declare lockVersion: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare author?: NonAttribute<User>;
  declare checker?: NonAttribute<User | null>;
  declare loadCaseRecord?: NonAttribute<LoadCaseRecord>;
  declare items?: NonAttribute<ShortlistItem[]>;
}

export class ShortlistItem extends Model<InferAttributes<ShortlistItem>, InferCreationAttributes<ShortlistItem>> {
  declare id: CreationOptional<number>;
  declare shortlistId: number;
  declare propertySetId: number;
  declare position: number;
  declare note: string;
  declare lockVersion: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare propertySet?: NonAttribute<PropertySet>;
}

export class DesignRecord extends Model<InferAttributes<DesignRecord>, InferCreationAttributes<DesignRecord>> {
  declare id: CreationOptional<number>;
  declare shortlistId: number;
  declare projectId: number;
  declare content: DesignRecordContent;
  declare createdAt: CreationOptional<Date>;
}

export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare role: Role;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare usedAt: Date | null;
  declare invitedById: number | null;
  declare revokedAt: CreationOptional<Date | null>;
  declare revokedById: CreationOptional<number | null>;
  declare sentAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
}

export class PasswordReset extends Model<InferAttributes<PasswordReset>, InferCreationAttributes<PasswordReset>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare usedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
}


export function initProjectModels(db: Sequelize): void {
  Project.init(
    {
      ...serialId(),
      name: { type: DataTypes.TEXT, allowNull: false },
      description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      ownerId: { type: DataTypes.INTEGER, allowNull: false },
      ...lockVersionColumn(),
      ...timestamps(),
    },
    { sequelize: db, tableName: 'projects', version: 'lockVersion' },
  );
  ProjectMember.init(
    {
      projectId: { type: DataTypes.INTEGER, primaryKey: true },
      userId: { type: DataTypes.INTEGER, primaryKey: true },
      addedById: { type: DataTypes.INTEGER },
      createdAt: stamp(),
    },
    { sequelize: db, tableName: 'project_members', updatedAt: false },
  );
  LoadCaseRecord.init(
    {
      ...serialId(),
      projectId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      loadCase: { type: DataTypes.JSONB, allowNull: false },
      filters: { type: DataTypes.JSONB },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      createdById: { type: DataTypes.INTEGER },
      ...lockVersionColumn(),
      ...timestamps(),
    },
    { sequelize: db, tableName: 'load_cases', version: 'lockVersion' },
  );
  Shortlist.init(
    {
      ...serialId(),
      projectId: { type: DataTypes.INTEGER, allowNull: false },
      loadCaseId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'open' },
      authorId: { type: DataTypes.INTEGER, allowNull: false },
      checkerId: { type: DataTypes.INTEGER },
      submittedAt: { type: DataTypes.DATE },
      checkedAt: { type: DataTypes.DATE },
      returnedComment: { type: DataTypes.TEXT },
      checkComment: { type: DataTypes.TEXT },
      submission: { type: DataTypes.JSONB },
      rounds: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      ...lockVersionColumn(),
      ...timestamps(),
    },
    { sequelize: db, tableName: 'shortlists', version: 'lockVersion' },
  );
  ShortlistItem.init(
    {
      ...serialId(),
      shortlistId: { type: DataTypes.INTEGER, allowNull: false },
      propertySetId: { type: DataTypes.INTEGER, allowNull: false },
      position: { type: DataTypes.INTEGER, allowNull: false },
      note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      ...lockVersionColumn(),
      ...timestamps(),
    },
    { sequelize: db, tableName: 'shortlist_items', version: 'lockVersion' },
  );
  DesignRecord.init(
    {
      ...serialId(),
      shortlistId: { type: DataTypes.INTEGER, allowNull: false, unique: true },
      projectId: { type: DataTypes.INTEGER, allowNull: false },
      content: { type: DataTypes.JSONB, allowNull: false },
      createdAt: stamp(),
    },
    { sequelize: db, tableName: 'design_records', updatedAt: false },
  );
  Invitation.init(
    {
      ...serialId(),
      email: { type: DataTypes.TEXT, allowNull: false },
      role: { type: DataTypes.TEXT, allowNull: false },
      tokenHash: { type: DataTypes.TEXT, allowNull: false, unique: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      usedAt: { type: DataTypes.DATE },
      invitedById: { type: DataTypes.INTEGER },
      revokedAt: { type: DataTypes.DATE },
      revokedById: { type: DataTypes.INTEGER },
      sentAt: { type: DataTypes.DATE },
      createdAt: stamp(),
    },
    { sequelize: db, tableName: 'invitations', updatedAt: false },
  );
  PasswordReset.init(
    {
      ...serialId(),
      userId: { type: DataTypes.INTEGER, allowNull: false },
      tokenHash: { type: DataTypes.TEXT, allowNull: false, unique: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      usedAt: { type: DataTypes.DATE },
      createdAt: stamp(),
    },
    { sequelize: db, tableName: 'password_resets', updatedAt: false },
  );

  Project.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' });
  Project.belongsToMany(User, { as: 'members', through: ProjectMember, foreignKey: 'projectId', otherKey: 'userId' });
  LoadCaseRecord.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
  Shortlist.belongsTo(User, { as: 'author', foreignKey: 'authorId' });
  Shortlist.belongsTo(User, { as: 'checker', foreignKey: 'checkerId' });
  Shortlist.belongsTo(LoadCaseRecord, { as: 'loadCaseRecord', foreignKey: 'loadCaseId' });
  Shortlist.hasMany(ShortlistItem, { as: 'items', foreignKey: 'shortlistId' });
  ShortlistItem.belongsTo(PropertySet, { as: 'propertySet', foreignKey: 'propertySetId' });
}

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
import { CreatedOnlyModel, OneTimeTokenModel, VersionedModel, createdOnlyColumns, createdOnlyTable, oneTimeTokenColumns, stamp, versionedColumns, versionedTable } from './columns';

export class Project extends VersionedModel<InferAttributes<Project>, InferCreationAttributes<Project>> {
  declare name: string;
  declare description: string;
  declare ownerId: number;
  declare owner?: NonAttribute<User>;
  declare members?: NonAttribute<User[]>;
}

export class ProjectMember extends Model<InferAttributes<ProjectMember>, InferCreationAttributes<ProjectMember>> {
  declare projectId: number;
  declare userId: number;
  declare addedById: number | null;
  declare createdAt: CreationOptional<Date>;
}

export class LoadCaseRecord extends VersionedModel<InferAttributes<LoadCaseRecord>, InferCreationAttributes<LoadCaseRecord>> {
  declare projectId: number;
  declare name: string;
  declare loadCase: LoadCase;
  declare filters: Record<string, unknown> | null;
  declare notes: string;
  declare createdById: number | null;
  declare createdBy?: NonAttribute<User | null>;
}

export class Shortlist extends VersionedModel<InferAttributes<Shortlist>, InferCreationAttributes<Shortlist>> {
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
  declare author?: NonAttribute<User>;
  declare checker?: NonAttribute<User | null>;
  declare loadCaseRecord?: NonAttribute<LoadCaseRecord>;
  declare items?: NonAttribute<ShortlistItem[]>;
}

export class ShortlistItem extends VersionedModel<InferAttributes<ShortlistItem>, InferCreationAttributes<ShortlistItem>> {
  declare shortlistId: number;
  declare propertySetId: number;
  declare position: number;
  declare note: string;
  declare propertySet?: NonAttribute<PropertySet>;
}

export class DesignRecord extends CreatedOnlyModel<InferAttributes<DesignRecord>, InferCreationAttributes<DesignRecord>> {
  declare shortlistId: number;
  declare projectId: number;
  declare content: DesignRecordContent;
}

export class Invitation extends OneTimeTokenModel<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare email: string;
  declare role: Role;
  declare invitedById: number | null;
  declare revokedAt: CreationOptional<Date | null>;
  declare revokedById: CreationOptional<number | null>;
  declare sentAt: CreationOptional<Date | null>;
}

export class PasswordReset extends OneTimeTokenModel<InferAttributes<PasswordReset>, InferCreationAttributes<PasswordReset>> {
  declare userId: number;
}


export function initProjectModels(db: Sequelize): void {
  Project.init(
    versionedColumns({
      name: { type: DataTypes.TEXT, allowNull: false },
      description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      ownerId: { type: DataTypes.INTEGER, allowNull: false },
    }),
    versionedTable(db, 'projects'),
  );
  ProjectMember.init(
    {
      projectId: { type: DataTypes.INTEGER, primaryKey: true },
      userId: { type: DataTypes.INTEGER, primaryKey: true },
      addedById: { type: DataTypes.INTEGER },
      createdAt: stamp(),
    },
    createdOnlyTable(db, 'project_members'),
  );
  LoadCaseRecord.init(
    versionedColumns({
      projectId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      loadCase: { type: DataTypes.JSONB, allowNull: false },
      filters: { type: DataTypes.JSONB },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      createdById: { type: DataTypes.INTEGER },
    }),
    versionedTable(db, 'load_cases'),
  );
  Shortlist.init(
    versionedColumns({
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
    }),
    versionedTable(db, 'shortlists'),
  );
  ShortlistItem.init(
    versionedColumns({
      shortlistId: { type: DataTypes.INTEGER, allowNull: false },
      propertySetId: { type: DataTypes.INTEGER, allowNull: false },
      position: { type: DataTypes.INTEGER, allowNull: false },
      note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    }),
    versionedTable(db, 'shortlist_items'),
  );
  DesignRecord.init(
    createdOnlyColumns({
      shortlistId: { type: DataTypes.INTEGER, allowNull: false, unique: true },
      projectId: { type: DataTypes.INTEGER, allowNull: false },
      content: { type: DataTypes.JSONB, allowNull: false },
    }),
    createdOnlyTable(db, 'design_records'),
  );
  Invitation.init(
    createdOnlyColumns({
      email: { type: DataTypes.TEXT, allowNull: false },
      role: { type: DataTypes.TEXT, allowNull: false },
      ...oneTimeTokenColumns(),
      invitedById: { type: DataTypes.INTEGER },
      revokedAt: { type: DataTypes.DATE },
      revokedById: { type: DataTypes.INTEGER },
      sentAt: { type: DataTypes.DATE },
    }),
    createdOnlyTable(db, 'invitations'),
  );
  PasswordReset.init(
    createdOnlyColumns({
      userId: { type: DataTypes.INTEGER, allowNull: false },
      ...oneTimeTokenColumns(),
    }),
    createdOnlyTable(db, 'password_resets'),
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

// Column definitions and fields that several models share: timestamps, the serial key, the lock
// version, the versioned row (all three), and the workflow columns of reviewed records (reference
// versions) and of curated records (property sets, rating tables).
import { DataTypes, Model, type CreationOptional, type InitOptions, type ModelStatic, type NonAttribute, type Sequelize } from 'sequelize';
import type { CuratedStatus } from '../../../shared/workflows/curated';
import type { Material, Reference, User } from './index';
import type { ReferenceVersion } from './references';

// Functions, not shared objects: Sequelize writes into each attribute's definition (its field
// name, its model), so two attributes or two models must never share one object.
export const stamp = () => ({ type: DataTypes.DATE, allowNull: false });
export const timestamps = () => ({ createdAt: stamp(), updatedAt: stamp() });
export const serialId = () => ({ id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true } });
/** With the model option `version: 'lockVersion'` (see server/services/optimistic-lock.ts). */
export const lockVersionColumn = () => ({ lockVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 } });

/** A row's attributes with a serial key and timestamps around the table's own columns. */
export const timestampedColumns = <C extends object>(columns: C) => ({ ...serialId(), ...columns, ...timestamps() });

/**
 * A versioned row's attributes (decision 7): the serial key, the table's own columns, the lock
 * version and the timestamps, in that order. Goes with `versionedTable` for the model options.
 */
export const versionedColumns = <C extends object>(columns: C) => ({ ...serialId(), ...columns, ...lockVersionColumn(), ...timestamps() });

/** The model options of a versioned table: Sequelize checks and bumps `lockVersion` on every save. */
export const versionedTable = <M extends Model>(db: Sequelize, tableName: string): InitOptions<M> => ({ sequelize: db, tableName, version: 'lockVersion' });

/** A row written once: the serial key, the table's own columns and its creation time. */
export const createdOnlyColumns = <C extends object>(columns: C) => ({ ...serialId(), ...columns, createdAt: stamp() });

/** A one-time link's token (stored as its SHA-256 only, decision 14), its expiry and when it was used. */
export const oneTimeTokenColumns = () => ({
  tokenHash: { type: DataTypes.TEXT, allowNull: false, unique: true },
  expiresAt: { type: DataTypes.DATE, allowNull: false },
  usedAt: { type: DataTypes.DATE },
});

/** The model options of a table whose rows are written once (created_at, no updated_at). */
export const createdOnlyTable = <M extends Model>(db: Sequelize, tableName: string): InitOptions<M> => ({ sequelize: db, tableName, updatedAt: false });

/** The review workflow's columns (status, lineage, who and when, lock version), for any reviewed row. */
export const workflowColumns = () => ({
  status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'draft' },
  lineageId: { type: DataTypes.INTEGER },
  supersedesId: { type: DataTypes.INTEGER },
  supersededById: { type: DataTypes.INTEGER },
  draftedById: { type: DataTypes.INTEGER },
  lastEditedById: { type: DataTypes.INTEGER },
  approvedById: { type: DataTypes.INTEGER },
  returnedComment: { type: DataTypes.TEXT },
  submittedAt: { type: DataTypes.DATE },
  publishedAt: { type: DataTypes.DATE },
  retiredAt: { type: DataTypes.DATE },
  ...lockVersionColumn(),
  ...timestamps(),
});

/** A reference's citation, as the reference and each of its versions hold it. */
export const citationColumns = () => ({
  kind: { type: DataTypes.TEXT, allowNull: false },
  title: { type: DataTypes.TEXT, allowNull: false },
  authors: { type: DataTypes.TEXT },
  year: { type: DataTypes.INTEGER },
  identifier: { type: DataTypes.TEXT },
  location: { type: DataTypes.TEXT },
  note: { type: DataTypes.TEXT },
});

/** The workflow columns of a curated record, with its material, reference and version number. */
export const curatedColumns = () => ({
  materialId: { type: DataTypes.INTEGER, allowNull: false },
  referenceId: { type: DataTypes.INTEGER },
  referenceVersionId: { type: DataTypes.INTEGER },
  version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
  ...workflowColumns(),
});

/** The fields of a row with a serial key and timestamps, for models that extend it. */
export abstract class TimestampedModel<A extends object = object, C extends object = A> extends Model<A, C> {
  declare id: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** The fields of a versioned row (serial key, lock version, timestamps), for models that extend it. */
export abstract class VersionedModel<A extends object = object, C extends object = A> extends TimestampedModel<A, C> {
  declare lockVersion: CreationOptional<number>;
}

/** The fields of a row written once (serial key, creation time), for models that extend it. */
export abstract class CreatedOnlyModel<A extends object = object, C extends object = A> extends Model<A, C> {
  declare id: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
}

/** The fields of a one-time link's row: what `oneTimeTokenColumns()` declares. */
export abstract class OneTimeTokenModel<A extends object = object, C extends object = A> extends CreatedOnlyModel<A, C> {
  declare tokenHash: string;
  declare expiresAt: Date;
  declare usedAt: Date | null;
}

/**
 * The fields of a reviewed row (status, lineage, who drafted, edited and approved it, when), for
 * models that extend it: what `workflowColumns()` declares.
 */
export abstract class WorkflowModel<A extends object = object, C extends object = A> extends VersionedModel<A, C> {
  declare status: CreationOptional<CuratedStatus>;
  declare lineageId: number | null;
  declare supersedesId: number | null;
  declare supersededById: CreationOptional<number | null>;
  declare draftedById: number | null;
  declare lastEditedById: CreationOptional<number | null>;
  declare approvedById: CreationOptional<number | null>;
  /** The reviewer's comment when the record in review was sent back to its author. */
  declare returnedComment: CreationOptional<string | null>;
  declare submittedAt: CreationOptional<Date | null>;
  declare publishedAt: CreationOptional<Date | null>;
  declare retiredAt: CreationOptional<Date | null>;

  declare draftedBy?: NonAttribute<User | null>;
  declare lastEditedBy?: NonAttribute<User | null>;
  declare approvedBy?: NonAttribute<User | null>;
}

/**
 * The fields of a curated record (its material and reference, version and the workflow's fields),
 * for models that extend it; the content columns are each model's own.
 */
export abstract class CuratedModel<A extends object = object, C extends object = A> extends WorkflowModel<A, C> {
  declare materialId: number;
  declare referenceId: number | null;
  /** The version of the reference it was published with (null while draft or in review: it cites the current one). */
  declare referenceVersionId: CreationOptional<number | null>;
  declare version: CreationOptional<number>;

  declare material?: NonAttribute<Material>;
  declare reference?: NonAttribute<Reference | null>;
  declare citedVersion?: NonAttribute<ReferenceVersion | null>;
}

/** Who drafted, last edited and approved a reviewed row. */
export function workflowAssociations(model: ModelStatic<WorkflowModel>, user: ModelStatic<Model>): void {
  model.belongsTo(user, { as: 'draftedBy', foreignKey: 'draftedById' });
  model.belongsTo(user, { as: 'lastEditedBy', foreignKey: 'lastEditedById' });
  model.belongsTo(user, { as: 'approvedBy', foreignKey: 'approvedById' });
}

/** A curated record's material, reference (and the version of it a published record cites) and people. */
export function curatedAssociations(
  model: ModelStatic<CuratedModel>,
  to: { Material: ModelStatic<Model>; Reference: ModelStatic<Model>; ReferenceVersion: ModelStatic<Model>; User: ModelStatic<Model> },
): void {
  model.belongsTo(to.Material, { as: 'material', foreignKey: 'materialId' });
  model.belongsTo(to.Reference, { as: 'reference', foreignKey: 'referenceId' });
  // The key in the table is (reference_id, reference_version_id); the association needs only the version's id.
  model.belongsTo(to.ReferenceVersion, { as: 'citedVersion', foreignKey: 'referenceVersionId', constraints: false });
  workflowAssociations(model, to.User);
}

// Column definitions and fields that several models share: timestamps, the serial key, the lock
// version, and the workflow columns of curated records (property sets, rating tables).
import { DataTypes, Model, type CreationOptional, type ModelStatic, type NonAttribute } from 'sequelize';
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

/** The workflow columns of a curated record, with its material, reference and version number. */
export const curatedColumns = () => ({
  materialId: { type: DataTypes.INTEGER, allowNull: false },
  referenceId: { type: DataTypes.INTEGER },
  referenceVersionId: { type: DataTypes.INTEGER },
  version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
  ...workflowColumns(),
});

/**
 * The fields of a curated record (status, version and lineage, who drafted, edited and approved
 * it, when), for models that extend it; the content columns are each model's own.
 */
export abstract class CuratedModel<A extends object = object, C extends object = A> extends Model<A, C> {
  declare id: CreationOptional<number>;
  declare materialId: number;
  declare referenceId: number | null;
  /** The version of the reference it was published with (null while draft or in review: it cites the current one). */
  declare referenceVersionId: CreationOptional<number | null>;
  declare status: CreationOptional<CuratedStatus>;
  declare version: CreationOptional<number>;
  declare lineageId: number | null;
  declare supersedesId: number | null;
  declare supersededById: number | null;
  declare draftedById: number | null;
  declare lastEditedById: CreationOptional<number | null>;
  declare approvedById: number | null;
  /** The reviewer's comment when the record in review was sent back to its author. */
  declare returnedComment: CreationOptional<string | null>;
  declare submittedAt: CreationOptional<Date | null>;
  declare publishedAt: Date | null;
  declare retiredAt: Date | null;
  declare lockVersion: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare material?: NonAttribute<Material>;
  declare reference?: NonAttribute<Reference | null>;
  declare citedVersion?: NonAttribute<ReferenceVersion | null>;
  declare draftedBy?: NonAttribute<User | null>;
  declare lastEditedBy?: NonAttribute<User | null>;
  declare approvedBy?: NonAttribute<User | null>;
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
  model.belongsTo(to.User, { as: 'draftedBy', foreignKey: 'draftedById' });
  model.belongsTo(to.User, { as: 'lastEditedBy', foreignKey: 'lastEditedById' });
  model.belongsTo(to.User, { as: 'approvedBy', foreignKey: 'approvedById' });
}

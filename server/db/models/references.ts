// The versions of a reference (reviewed like a curated record) and its uploaded documents (one
// row per upload, never deleted). See migrations 0009 and 0010.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { ReferenceCitationDto } from '../../../shared/schemas/catalogue';
import { Reference, User } from './index';
import { WorkflowModel, citationColumns, serialId, stamp, versionedTable, workflowAssociations, workflowColumns } from './columns';

/**
 * One version of a reference's citation. Its `referenceId` is the reference it is a version of
 * (so the curated step table's "cites a reference" always holds); `version` counts per reference.
 */
export class ReferenceVersion extends WorkflowModel<InferAttributes<ReferenceVersion>, InferCreationAttributes<ReferenceVersion>> {
  declare referenceId: number;
  declare version: number;
  declare reference?: NonAttribute<Reference>;
}
// The citation's fields (kind, title, authors, year, identifier, location, note), as the reference has them.
export interface ReferenceVersion extends ReferenceCitationDto {}

/** One uploaded document of a reference: version n of its documents, with its object-store key. */
export class ReferenceDocument extends Model<InferAttributes<ReferenceDocument>, InferCreationAttributes<ReferenceDocument>> {
  declare id: CreationOptional<number>;
  declare referenceId: number;
  declare version: number;
  declare storageKey: string;
  declare name: string;
  declare size: number;
  declare uploadedById: number | null;
  declare uploadedAt: Date;

  declare uploadedBy?: NonAttribute<User | null>;
}

export function initReferenceModels(db: Sequelize): void {
  ReferenceVersion.init(
    {
      ...serialId(),
      referenceId: { type: DataTypes.INTEGER, allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false },
      ...citationColumns(),
      ...workflowColumns(),
    },
    versionedTable(db, 'reference_versions'),
  );
  ReferenceDocument.init(
    {
      ...serialId(),
      referenceId: { type: DataTypes.INTEGER, allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false },
      storageKey: { type: DataTypes.TEXT, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      // BIGINT comes back from pg as a string; documents are at most 20 MB, so a number is exact.
      size: {
        type: DataTypes.BIGINT,
        allowNull: false,
        get(this: ReferenceDocument) {
          return Number(this.getDataValue('size') as unknown);
        },
      },
      uploadedById: { type: DataTypes.INTEGER },
      uploadedAt: stamp(),
    },
    { sequelize: db, tableName: 'reference_documents', timestamps: false },
  );
  ReferenceVersion.belongsTo(Reference, { as: 'reference', foreignKey: 'referenceId' });
  workflowAssociations(ReferenceVersion, User);
  ReferenceDocument.belongsTo(User, { as: 'uploadedBy', foreignKey: 'uploadedById' });
}

// The versions of a reference (reviewed like a curated record) and its uploaded documents (one
// row per upload, never deleted). See migrations 0009 and 0010.
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { CuratedStatus } from '../../../shared/workflows/curated';
import type { ReferenceKind } from '../../../shared/schemas/catalogue';
import { Reference, User } from './index';
import { serialId, stamp, workflowColumns } from './columns';

/**
 * One version of a reference's citation. Its `referenceId` is the reference it is a version of
 * (so the curated step table's "cites a reference" always holds); `version` counts per reference.
 */
export class ReferenceVersion extends Model<InferAttributes<ReferenceVersion>, InferCreationAttributes<ReferenceVersion>> {
  declare id: CreationOptional<number>;
  declare referenceId: number;
  declare version: number;
  declare kind: ReferenceKind;
  declare title: string;
  declare authors: string | null;
  declare year: number | null;
  declare identifier: string | null;
  declare location: string | null;
  declare note: string | null;
  declare status: CreationOptional<CuratedStatus>;
  declare lineageId: number | null;
  declare supersedesId: number | null;
  declare supersededById: CreationOptional<number | null>;
  declare draftedById: number | null;
  declare lastEditedById: CreationOptional<number | null>;
  declare approvedById: CreationOptional<number | null>;
  declare returnedComment: CreationOptional<string | null>;
  declare submittedAt: CreationOptional<Date | null>;
  declare publishedAt: CreationOptional<Date | null>;
  declare retiredAt: CreationOptional<Date | null>;
  declare lockVersion: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare reference?: NonAttribute<Reference>;
  declare draftedBy?: NonAttribute<User | null>;
  declare lastEditedBy?: NonAttribute<User | null>;
  declare approvedBy?: NonAttribute<User | null>;
}

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
      kind: { type: DataTypes.TEXT, allowNull: false },
      title: { type: DataTypes.TEXT, allowNull: false },
      authors: { type: DataTypes.TEXT },
      year: { type: DataTypes.INTEGER },
      identifier: { type: DataTypes.TEXT },
      location: { type: DataTypes.TEXT },
      note: { type: DataTypes.TEXT },
      ...workflowColumns(),
    },
    { sequelize: db, tableName: 'reference_versions', version: 'lockVersion' },
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
  ReferenceVersion.belongsTo(User, { as: 'draftedBy', foreignKey: 'draftedById' });
  ReferenceVersion.belongsTo(User, { as: 'lastEditedBy', foreignKey: 'lastEditedById' });
  ReferenceVersion.belongsTo(User, { as: 'approvedBy', foreignKey: 'approvedById' });
  ReferenceDocument.belongsTo(User, { as: 'uploadedBy', foreignKey: 'uploadedById' });
}

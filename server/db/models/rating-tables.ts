import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { CuratedStatus } from '../../../shared/workflows/curated';
import type { RatingGeometryValue, RatingTableContent, RatingTableData } from '../../../shared/schemas/rating-tables';
import { Material, Reference, User } from './index';

export class RatingTable extends Model<InferAttributes<RatingTable>, InferCreationAttributes<RatingTable>> {
  declare id: CreationOptional<number>;
  declare materialId: number;
  declare referenceId: number | null;
  declare coversLineageIds: CreationOptional<number[]>;
  declare name: string;
  declare geometry: RatingGeometryValue;
  declare includedAngle: RatingTableContent['includedAngle'] | null;
  declare limits: RatingTableContent['limits'] | null;
  declare grade: string;
  declare note: string | null;
  declare data: RatingTableData;
  declare status: CreationOptional<CuratedStatus>;
  declare version: CreationOptional<number>;
  declare lineageId: number | null;
  declare supersedesId: number | null;
  declare supersededById: number | null;
  declare draftedById: number | null;
  declare lastEditedById: number | null;
  declare approvedById: number | null;
  declare returnedComment: CreationOptional<string | null>;
  declare submittedAt: CreationOptional<Date | null>;
  declare publishedAt: Date | null;
  declare retiredAt: Date | null;
  declare lockVersion: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare material?: NonAttribute<Material>;
  declare reference?: NonAttribute<Reference | null>;
  declare draftedBy?: NonAttribute<User | null>;
  declare lastEditedBy?: NonAttribute<User | null>;
  declare approvedBy?: NonAttribute<User | null>;
}

export function initRatingTableModels(db: Sequelize): void {
  RatingTable.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      materialId: { type: DataTypes.INTEGER, allowNull: false },
      referenceId: { type: DataTypes.INTEGER },
      coversLineageIds: { type: DataTypes.ARRAY(DataTypes.INTEGER), allowNull: false, defaultValue: [] },
      name: { type: DataTypes.TEXT, allowNull: false },
      geometry: { type: DataTypes.TEXT, allowNull: false },
      includedAngle: { type: DataTypes.JSONB },
      limits: { type: DataTypes.JSONB },
      grade: { type: DataTypes.TEXT, allowNull: false },
      note: { type: DataTypes.TEXT },
      data: { type: DataTypes.JSONB, allowNull: false },
      status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'draft' },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
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
      lockVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: { type: DataTypes.DATE, allowNull: false },
      updatedAt: { type: DataTypes.DATE, allowNull: false },
    },
    { sequelize: db, tableName: 'rating_tables', version: 'lockVersion' },
  );
  RatingTable.belongsTo(Material, { as: 'material', foreignKey: 'materialId' });
  RatingTable.belongsTo(Reference, { as: 'reference', foreignKey: 'referenceId' });
  RatingTable.belongsTo(User, { as: 'draftedBy', foreignKey: 'draftedById' });
  RatingTable.belongsTo(User, { as: 'lastEditedBy', foreignKey: 'lastEditedById' });
  RatingTable.belongsTo(User, { as: 'approvedBy', foreignKey: 'approvedById' });
}

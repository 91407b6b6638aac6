import { DataTypes, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { RatingGeometryValue, RatingTableContent, RatingTableData } from '../../../shared/schemas/rating-tables';
import { Material, Reference, User } from './index';
import { ReferenceVersion } from './references';
import { CuratedModel, curatedAssociations, curatedColumns, serialId, versionedTable } from './columns';

export class RatingTable extends CuratedModel<InferAttributes<RatingTable>, InferCreationAttributes<RatingTable>> {
  declare coversLineageIds: CreationOptional<number[]>;
  declare name: string;
  declare geometry: RatingGeometryValue;
  declare includedAngle: RatingTableContent['includedAngle'] | null;
  declare limits: RatingTableContent['limits'] | null;
  declare grade: string;
  declare note: string | null;
  declare data: RatingTableData;
}

export function initRatingTableModels(db: Sequelize): void {
  RatingTable.init(
    {
      ...serialId(),
      coversLineageIds: { type: DataTypes.ARRAY(DataTypes.INTEGER), allowNull: false, defaultValue: [] },
      name: { type: DataTypes.TEXT, allowNull: false },
      geometry: { type: DataTypes.TEXT, allowNull: false },
      includedAngle: { type: DataTypes.JSONB },
      limits: { type: DataTypes.JSONB },
      grade: { type: DataTypes.TEXT, allowNull: false },
      note: { type: DataTypes.TEXT },
      data: { type: DataTypes.JSONB, allowNull: false },
      ...curatedColumns(),
    },
    versionedTable(db, 'rating_tables'),
  );
  curatedAssociations(RatingTable, { Material, Reference, ReferenceVersion, User });
}

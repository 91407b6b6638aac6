import { DataTypes, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { ConfirmationStatus } from '../../../shared/workflows/confirmation';
import type { ProvenanceKey } from '../../../shared/schemas/provenance';
import { PropertySet, User } from './index';
import { VersionedModel, versionedColumns, versionedTable } from './columns';

export class ValueConfirmation extends VersionedModel<InferAttributes<ValueConfirmation>, InferCreationAttributes<ValueConfirmation>> {
  declare propertySetId: number;
  declare valueKey: ProvenanceKey;
  declare location: string;
  declare source: string | null;
  declare documentPage: number | null;
  declare status: CreationOptional<ConfirmationStatus>;
  declare proposedById: number;
  declare decidedById: CreationOptional<number | null>;
  declare decidedAt: CreationOptional<Date | null>;
  declare comment: CreationOptional<string | null>;
  declare propertySet?: NonAttribute<PropertySet>;
  declare proposedBy?: NonAttribute<User>;
  declare decidedBy?: NonAttribute<User | null>;
}

export function initValueConfirmationModels(db: Sequelize): void {
  ValueConfirmation.init(
    versionedColumns({
      propertySetId: { type: DataTypes.INTEGER, allowNull: false },
      valueKey: { type: DataTypes.TEXT, allowNull: false },
      location: { type: DataTypes.TEXT, allowNull: false },
      source: { type: DataTypes.TEXT },
      documentPage: { type: DataTypes.INTEGER },
      status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'proposed' },
      proposedById: { type: DataTypes.INTEGER, allowNull: false },
      decidedById: { type: DataTypes.INTEGER },
      decidedAt: { type: DataTypes.DATE },
      comment: { type: DataTypes.TEXT },
    }),
    versionedTable(db, 'value_confirmations'),
  );
  ValueConfirmation.belongsTo(PropertySet, { as: 'propertySet', foreignKey: 'propertySetId' });
  ValueConfirmation.belongsTo(User, { as: 'proposedBy', foreignKey: 'proposedById' });
  ValueConfirmation.belongsTo(User, { as: 'decidedBy', foreignKey: 'decidedById' });
}

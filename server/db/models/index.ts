import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
} from 'sequelize';
import { sequelize } from '../sequelize';
import { initProjectModels } from './projects';
import { initRatingTableModels } from './rating-tables';
import { initValueConfirmationModels } from './value-confirmations';
import { initReferenceModels, ReferenceVersion } from './references';
import { CuratedModel, TimestampedModel, VersionedModel, citationColumns, createdOnlyTable, curatedAssociations, curatedColumns, serialId, timestampedColumns, versionedColumns, versionedTable } from './columns';
import type {
  CyclesPoint,
  Family,
  HoursPoint,
  Quantity,
  ReferenceCitationDto,
  TemperaturePoint,
  ValueDetail,
} from '../../../shared/schemas/catalogue';
import type { Role } from '../../../shared/schemas/auth';
import type { Provenance } from '../../../shared/schemas/provenance';

export class User extends TimestampedModel<InferAttributes<User>, InferCreationAttributes<User>> {
  declare email: string;
  declare name: string;
  declare role: Role;
  declare passwordHash: string | null;
  declare active: CreationOptional<boolean>;
  declare lastLoginAt: Date | null;
}

export class Material extends TimestampedModel<InferAttributes<Material>, InferCreationAttributes<Material>> {
  declare name: string;
  declare family: Family;
  declare transparent: boolean;
  declare description: string | null;
}

export class Reference extends VersionedModel<InferAttributes<Reference>, InferCreationAttributes<Reference>> {
  declare createdById: ForeignKey<User['id']> | null;
  /** Object-store key of the uploaded document (null: none); name, size and time go with it. */
  declare documentKey: CreationOptional<string | null>;
  declare documentName: CreationOptional<string | null>;
  declare documentSize: CreationOptional<number | null>;
  declare documentUploadedAt: CreationOptional<Date | null>;
  /** Which version of the reference's documents the document_* columns name (reference_documents). */
  declare documentVersion: CreationOptional<number | null>;
  /** The published version of the citation, whose content these columns hold (reference_versions). */
  declare version: CreationOptional<number>;
}

// The citation's fields (kind, title, authors, year, identifier, location, note), as each version has them.
export interface Reference extends ReferenceCitationDto {}

export class PropertySet extends CuratedModel<InferAttributes<PropertySet>, InferCreationAttributes<PropertySet>> {
  declare condition: string;
  declare density: number;
  declare youngsModulus: number;
  declare poissonsRatio: number;
  declare tensileStrength: number;
  declare tensileYield: number | null;
  declare compressiveStrength: number;
  declare compressiveYield: number | null;
  declare shearStrength: number;
  declare shearYield: CreationOptional<number | null>;
  declare elongation: number | null;
  declare luminousTransmittance: number | null;
  declare serviceTempMin: number;
  declare serviceTempMax: number;
  declare valueDetails: CreationOptional<Partial<Record<Quantity, ValueDetail>>>;
  declare temperatureFactors: CreationOptional<TemperaturePoint[]>;
  declare sustainedLoadFactors: CreationOptional<HoursPoint[]>;
  declare cyclicFactors: CreationOptional<CyclesPoint[]>;
  declare provenance: CreationOptional<Provenance>;
}

export class AuditEntry extends Model<InferAttributes<AuditEntry>, InferCreationAttributes<AuditEntry>> {
  declare id: CreationOptional<number>;
  declare actorId: number | null;
  declare action: string;
  declare entityType: string;
  declare entityId: string | null;
  declare before: unknown;
  declare after: unknown;
  declare createdAt: CreationOptional<Date>;

  declare actor?: NonAttribute<User | null>;
}

const real = (allowNull = false) => ({ type: DataTypes.DOUBLE, allowNull });

let initialised = false;

/** Bind the models to this process's Sequelize instance (idempotent). */
export function initModels(): void {
  if (initialised) return;
  const db = sequelize();
  User.init(
    timestampedColumns({
      email: { type: DataTypes.TEXT, allowNull: false, unique: true },
      name: { type: DataTypes.TEXT, allowNull: false },
      role: { type: DataTypes.TEXT, allowNull: false },
      passwordHash: { type: DataTypes.TEXT },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      lastLoginAt: { type: DataTypes.DATE },
    }),
    { sequelize: db, tableName: 'users' },
  );
  Material.init(
    timestampedColumns({
      name: { type: DataTypes.TEXT, allowNull: false, unique: true },
      family: { type: DataTypes.TEXT, allowNull: false },
      transparent: { type: DataTypes.BOOLEAN, allowNull: false },
      description: { type: DataTypes.TEXT },
    }),
    { sequelize: db, tableName: 'materials' },
  );
  Reference.init(
    versionedColumns({
      ...citationColumns(),
      createdById: { type: DataTypes.INTEGER },
      documentKey: { type: DataTypes.TEXT },
      documentName: { type: DataTypes.TEXT },
      // BIGINT comes back from pg as a string; documents are at most 20 MB, so a number is exact.
      documentSize: {
        type: DataTypes.BIGINT,
        get(this: Reference) {
          const raw = this.getDataValue('documentSize') as unknown;
          return raw == null ? null : Number(raw);
        },
      },
      documentUploadedAt: { type: DataTypes.DATE },
      documentVersion: { type: DataTypes.INTEGER },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    }),
    versionedTable(db, 'data_references'),
  );
  initReferenceModels(db);
  PropertySet.init(
    {
      ...serialId(),
      condition: { type: DataTypes.TEXT, allowNull: false },
      density: real(),
      youngsModulus: real(),
      poissonsRatio: real(),
      tensileStrength: real(),
      tensileYield: real(true),
      compressiveStrength: real(),
      compressiveYield: real(true),
      shearStrength: real(),
      shearYield: real(true),
      elongation: real(true),
      luminousTransmittance: real(true),
      serviceTempMin: { type: DataTypes.DOUBLE, allowNull: false, field: 'service_temp_min' },
      serviceTempMax: { type: DataTypes.DOUBLE, allowNull: false, field: 'service_temp_max' },
      valueDetails: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      temperatureFactors: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      sustainedLoadFactors: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      cyclicFactors: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      provenance: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      ...curatedColumns(),
    },
    versionedTable(db, 'property_sets'),
  );
  AuditEntry.init(
    {
      id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
      actorId: { type: DataTypes.INTEGER },
      action: { type: DataTypes.TEXT, allowNull: false },
      entityType: { type: DataTypes.TEXT, allowNull: false },
      entityId: { type: DataTypes.TEXT },
      before: { type: DataTypes.JSONB },
      after: { type: DataTypes.JSONB },
      createdAt: { type: DataTypes.DATE, allowNull: false },
    },
    createdOnlyTable(db, 'audit_log'),
  );

  curatedAssociations(PropertySet, { Material, Reference, ReferenceVersion, User });
  Material.hasMany(PropertySet, { as: 'propertySets', foreignKey: 'materialId' });
  AuditEntry.belongsTo(User, { as: 'actor', foreignKey: 'actorId', constraints: false });
  initProjectModels(db);
  initRatingTableModels(db);
  initValueConfirmationModels(db);
  initialised = true;
}

export { RatingTable } from './rating-tables';
export { ValueConfirmation } from './value-confirmations';
export { ReferenceDocument, ReferenceVersion } from './references';

import { Op, UniqueConstraintError, type Transaction, type WhereOptions, type Includeable } from 'sequelize';
import { Material, PropertySet, Reference, ReferenceVersion } from '../../db/models';
import { sequelize } from '../../db/sequelize';
import { recordAudit } from '../../services/audit';
import { mechanicalValues } from '../../../shared/engine/candidates';
import type { LibrarySetDto } from '../../../shared/schemas/library';
import type {
  MaterialDetailDto,
  MaterialDto,
  MaterialInput,
  MaterialListDto,
  PropertySetDto,
  PropertySetListDto,
  PropertySetQuery,
  PropertySetStatus,
  ReferenceDto,
} from '../../../shared/schemas/catalogue';
import { conflict, forbidden, notFound } from '../../errors';
import { curatedIdentity, reviewTrailInclude, userRef } from '../../workflows/review-trail';

/** Statuses a caller may read: drafts and reviews stay on the library desk. */
export function readableStatuses(canDraft: boolean): PropertySetStatus[] {
  return canDraft ? ['draft', 'in-review', 'published', 'retired'] : ['published', 'retired'];
}

export function materialDto(m: Material): MaterialDto {
  return { id: m.id, name: m.name, family: m.family, transparent: m.transparent, description: m.description };
}

/**
 * A citation: the reference's current content, or, for a record published with an earlier
 * version (`cited`), that version's. The documents are the reference's (the latest one).
 */
export function referenceDto(r: Reference, cited?: ReferenceVersion | null): ReferenceDto {
  const c = cited ?? r;
  return {
    id: r.id,
    kind: c.kind,
    title: c.title,
    authors: c.authors,
    year: c.year,
    identifier: c.identifier,
    location: c.location,
    note: c.note,
    version: cited?.version ?? r.version,
    latestVersion: r.version,
    hasDocument: !!r.documentKey,
    documentVersion: r.documentVersion ?? null,
  };
}

/** The include that brings the version of its reference a published record cites. */
export const citedVersionInclude = () => ({ model: ReferenceVersion, as: 'citedVersion' });

export function propertySetDto(ps: PropertySet): PropertySetDto {
  return {
    ...curatedIdentity(ps),
    condition: ps.condition,
    material: materialDto(ps.material!),
    reference: ps.reference ? referenceDto(ps.reference, ps.citedVersion) : null,
    ...mechanicalValues(ps),
    elongation: ps.elongation,
    luminousTransmittance: ps.luminousTransmittance,
    serviceTemperature: { min: ps.serviceTempMin, max: ps.serviceTempMax },
    valueDetails: ps.valueDetails ?? {},
    provenance: ps.provenance ?? {},
    temperatureFactors: ps.temperatureFactors ?? [],
    sustainedLoadFactors: ps.sustainedLoadFactors ?? [],
    cyclicFactors: ps.cyclicFactors ?? [],
    draftedBy: userRef(ps.draftedBy),
    approvedBy: userRef(ps.approvedBy),
    publishedAt: ps.publishedAt ? ps.publishedAt.toISOString() : null,
    updatedAt: ps.updatedAt.toISOString(),
    supersededById: ps.supersededById ?? null,
  };
}

/** What a librarian sees on the desk: the public DTO plus lock, lineage and review fields. */
export function librarySetDto(ps: PropertySet): LibrarySetDto {
  return {
    ...propertySetDto(ps),
    lockVersion: ps.lockVersion,
    lineageId: ps.lineageId,
    supersedesId: ps.supersedesId,
    supersededById: ps.supersededById ?? null,
    returnedComment: ps.returnedComment ?? null,
    lastEditedBy: userRef(ps.lastEditedBy),
    submittedAt: ps.submittedAt ? ps.submittedAt.toISOString() : null,
  };
}

const escapeLike = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

export function include(materialWhere?: WhereOptions<Material>): Includeable[] {
  return [
    { model: Material, as: 'material', required: true, ...(materialWhere ? { where: materialWhere } : {}) },
    { model: Reference, as: 'reference' },
    citedVersionInclude(),
    ...reviewTrailInclude(),
  ];
}

export interface Caller {
  canDraft: boolean;
}

export async function listPropertySets(
  query: PropertySetQuery & { limit?: number; offset?: number },
  caller: Caller,
): Promise<PropertySetListDto> {
  const allowed = readableStatuses(caller.canDraft);
  const status = query.status ?? 'published';
  if (!allowed.includes(status)) throw forbidden('Only librarians can list drafts and sets in review.');

  const where: WhereOptions<PropertySet>[] = [{ status }];
  if (query.materialId !== undefined) where.push({ materialId: query.materialId });
  // Service temperature must cover the requested range.
  if (query.tmin !== undefined) where.push({ serviceTempMin: { [Op.lte]: query.tmin } }, { serviceTempMax: { [Op.gte]: query.tmin } });
  if (query.tmax !== undefined) where.push({ serviceTempMax: { [Op.gte]: query.tmax } }, { serviceTempMin: { [Op.lte]: query.tmax } });
  if (query.q) {
    for (const word of query.q.split(/\s+/).filter(Boolean).slice(0, 8)) {
      const like = { [Op.iLike]: `%${escapeLike(word)}%` };
      where.push({
        [Op.or]: [
          { condition: like },
          { '$material.name$': like },
          { '$material.family$': like },
          { '$reference.title$': like },
          { '$reference.identifier$': like },
        ],
      } as WhereOptions<PropertySet>);
    }
  }
  const materialWhere: WhereOptions<Material> = {};
  if (query.family) Object.assign(materialWhere, { family: query.family });
  if (query.transparent !== undefined) Object.assign(materialWhere, { transparent: query.transparent });

  const { rows, count } = await PropertySet.findAndCountAll({
    where: { [Op.and]: where },
    include: include(Object.keys(materialWhere).length ? materialWhere : undefined),
    order: [
      [{ model: Material, as: 'material' }, 'family', 'ASC'],
      [{ model: Material, as: 'material' }, 'name', 'ASC'],
      ['condition', 'ASC'],
      ['version', 'DESC'],
    ],
    limit: query.limit,
    offset: query.offset,
    distinct: true,
  });
  return { items: rows.map(propertySetDto), total: count };
}

export async function getPropertySet(id: number, caller: Caller): Promise<PropertySetDto> {
  const ps = await PropertySet.findByPk(id, { include: include() });
  if (!ps || !readableStatuses(caller.canDraft).includes(ps.status)) throw notFound('Property set');
  return propertySetDto(ps);
}

export async function getMaterial(id: number, caller: Caller): Promise<MaterialDetailDto> {
  const material = await Material.findByPk(id);
  if (!material) throw notFound('Material');
  const sets = await PropertySet.findAll({
    where: { materialId: id, status: readableStatuses(caller.canDraft) },
    include: include(),
    order: [['status', 'ASC'], ['condition', 'ASC'], ['version', 'DESC']],
  });
  if (!sets.length && !caller.canDraft) throw notFound('Material');
  return { ...materialDto(material), propertySets: sets.map(propertySetDto) };
}

/** All materials, by family then name. */
export async function listMaterials(): Promise<MaterialListDto> {
  const rows = await Material.findAll({ order: [['family', 'ASC'], ['name', 'ASC']] });
  return { items: rows.map(materialDto), total: rows.length };
}

/** Material names are unique regardless of case (materials_name_lower_idx). */
export const duplicateMaterial = (name: string) =>
  conflict(`A material named "${name}" already exists. Choose it instead of creating a new one.`, 'duplicate');

/** Creates a material inside the caller's transaction; 409 "duplicate" on a name clash (any case). */
export async function createMaterialIn(transaction: Transaction, input: MaterialInput, actorId: number): Promise<Material> {
  const clash = await Material.findOne({
    where: sequelize().where(sequelize().fn('lower', sequelize().col('name')), input.name.toLowerCase()),
    transaction,
  });
  if (clash) throw duplicateMaterial(clash.name);
  try {
    const material = await Material.create(
      { name: input.name, family: input.family, transparent: input.transparent, description: input.description ?? null },
      { transaction },
    );
    await recordAudit(transaction, { actorId, action: 'create', entityType: 'material', entityId: material.id, before: null, after: materialDto(material) });
    return material;
  } catch (err) {
    // Two librarians creating the same name at once: the unique index decides.
    if (err instanceof UniqueConstraintError) throw duplicateMaterial(input.name);
    throw err;
  }
}

export async function createMaterial(input: MaterialInput, actorId: number): Promise<MaterialDto> {
  const material = await sequelize().transaction((transaction) => createMaterialIn(transaction, input, actorId));
  return materialDto(material);
}

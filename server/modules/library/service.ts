// The library desk: drafting property sets, four-eyes review, revisions that supersede a
// published version, and retirement. Every step runs in one transaction with a row lock, checks
// the caller's lock version, and writes an audit entry; e-mails go out after the commit.
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import { Material, PropertySet, Reference, User } from '../../db/models';
import { sequelize } from '../../db/sequelize';
import { badRequest, conflict, notFound } from '../../errors';
import { recordAudit } from '../../services/audit';
import { auditSnapshot as snapshot, lockCurrent } from '../../services/optimistic-lock';
import { draftWorkflowColumns, runCuratedStep, type Actor, type CuratedKind } from '../../workflows/curated-steps';
import type { CuratedStepName } from '../../../shared/workflows/curated';
import { PROVENANCE_KEYS } from '../../../shared/schemas/provenance';
import { QUANTITIES } from '../../../shared/schemas/catalogue';
import type { DraftData, LibrarySetDto, LibrarySetListDto, SetChangesDto, ValueChangeDto } from '../../../shared/schemas/library';
import { createMaterialIn, include, librarySetDto, referenceDto } from '../property-sets/service';
import { invalidateCatalogueSnapshot } from '../property-sets/snapshot';
import { referenceFields } from '../references/service';
import { keepCitedVersion } from '../references/versions';
import { keepApprovals, stampConfirmations } from './provenance';
import { closeOpenConfirmations } from './confirmations';

export type { Actor } from '../../workflows/curated-steps';

// ---------------------------------------------------------------------------------------------
// Reading

async function loadDto(id: number, transaction?: Transaction): Promise<LibrarySetDto> {
  const ps = await PropertySet.findByPk(id, { include: include(), transaction });
  if (!ps) throw notFound('Property set');
  return librarySetDto(ps);
}

export async function getLibrarySet(id: number): Promise<LibrarySetDto> {
  return loadDto(id);
}

export interface QueueQuery {
  status?: 'draft' | 'in-review';
  mine?: 'true' | 'false';
  limit: number;
  offset: number;
}

/** Drafts and sets in review (or one of the two); mine = drafted or last edited by the caller. */
export async function listQueue(query: QueueQuery, actor: Actor): Promise<LibrarySetListDto> {
  const where: WhereOptions<PropertySet>[] = [{ status: query.status ? [query.status] : ['draft', 'in-review'] }];
  if (query.mine === 'true') where.push({ [Op.or]: [{ draftedById: actor.id }, { lastEditedById: actor.id }] });
  const total = await PropertySet.count({ where: { [Op.and]: where } });
  const rows = await PropertySet.findAll({
    where: { [Op.and]: where },
    include: include(),
    order: [
      ['updatedAt', 'DESC'],
      ['id', 'DESC'],
    ],
    limit: query.limit,
    offset: query.offset,
  });
  return { items: rows.map(librarySetDto), total };
}

/** Compared fields of a set, as DTO paths. */
function comparable(dto: LibrarySetDto): Record<string, unknown> {
  const fields: Record<string, unknown> = {
    condition: dto.condition,
    'material.name': dto.material.name,
    'material.family': dto.material.family,
    'material.transparent': dto.material.transparent,
    'reference.kind': dto.reference?.kind ?? null,
    'reference.title': dto.reference?.title ?? null,
    'reference.authors': dto.reference?.authors ?? null,
    'reference.year': dto.reference?.year ?? null,
    'reference.identifier': dto.reference?.identifier ?? null,
    'reference.location': dto.reference?.location ?? null,
  };
  for (const q of QUANTITIES) fields[q] = dto[q] ?? null;
  fields['serviceTemperature.min'] = dto.serviceTemperature.min;
  fields['serviceTemperature.max'] = dto.serviceTemperature.max;
  for (const q of QUANTITIES) fields[`valueDetails.${q}`] = dto.valueDetails[q] ?? null;
  for (const k of PROVENANCE_KEYS) fields[`provenance.${k}`] = dto.provenance?.[k] ?? null;
  fields.temperatureFactors = dto.temperatureFactors;
  fields.sustainedLoadFactors = dto.sustainedLoadFactors;
  fields.cyclicFactors = dto.cyclicFactors;
  return fields;
}

/** JSON with object keys sorted, so equal values compare equal whatever their key order. */
function canonical(value: unknown): string {
  return JSON.stringify(value, (_key, v: unknown) =>
    v && typeof v === 'object' && !Array.isArray(v)
      ? Object.fromEntries(Object.entries(v as Record<string, unknown>).sort(([a], [b]) => a.localeCompare(b)))
      : v,
  );
}

export function diffSets(previous: LibrarySetDto, current: LibrarySetDto): ValueChangeDto[] {
  const before = comparable(previous);
  const after = comparable(current);
  return Object.keys(after)
    .filter((field) => canonical(before[field]) !== canonical(after[field]))
    .map((field) => ({ field, before: before[field], after: after[field] }));
}

/** What a set changes against the version it supersedes (none for a first version). */
export async function getChanges(id: number): Promise<SetChangesDto> {
  const current = await loadDto(id);
  if (!current.supersedesId) return { previous: null, changes: [] };
  const previous = await loadDto(current.supersedesId);
  return { previous, changes: diffSets(previous, current) };
}

// ---------------------------------------------------------------------------------------------
// Writing helpers

/** New ids from the table's sequence, so a new lineage can be its own first id in one insert. */
export async function nextSetIds(transaction: Transaction, count: number): Promise<number[]> {
  const [rows] = await sequelize().query(
    `SELECT nextval(pg_get_serial_sequence('property_sets', 'id'))::integer AS id FROM generate_series(1, :count)`,
    { transaction, replacements: { count } },
  );
  return (rows as { id: number }[]).map((r) => r.id);
}

/** A draft's values as PropertySet attributes: the one mapping of draft fields to the table (desk and import). */
export function valuesOf(d: DraftData) {
  return {
    condition: d.condition,
    density: d.density,
    youngsModulus: d.youngsModulus,
    poissonsRatio: d.poissonsRatio,
    tensileStrength: d.tensileStrength,
    tensileYield: d.tensileYield ?? null,
    compressiveStrength: d.compressiveStrength,
    compressiveYield: d.compressiveYield ?? null,
    shearStrength: d.shearStrength,
    shearYield: d.shearYield ?? null,
    elongation: d.elongation ?? null,
    luminousTransmittance: d.luminousTransmittance ?? null,
    serviceTempMin: d.serviceTemperature.min,
    serviceTempMax: d.serviceTemperature.max,
    valueDetails: d.valueDetails ?? {},
    provenance: d.provenance ?? {},
    temperatureFactors: d.temperatureFactors ?? [],
    sustainedLoadFactors: d.sustainedLoadFactors ?? [],
    cyclicFactors: d.cyclicFactors ?? [],
  };
}

/** The material of a draft: an existing one by id, or a new one created in this transaction. */
async function resolveMaterial(transaction: Transaction, d: DraftData, actor: Actor): Promise<number> {
  if (d.material) return (await createMaterialIn(transaction, d.material, actor.id)).id;
  const material = await Material.findByPk(d.materialId!, { transaction });
  if (!material) throw badRequest('The draft names a material that does not exist.', { materialId: 'no such material' });
  return material.id;
}

/** The reference of a draft: an existing one, a new one created in this transaction, or none. */
async function resolveReference(transaction: Transaction, d: DraftData, actor: Actor): Promise<number | null> {
  if (d.reference) {
    const r = d.reference;
    const created = await Reference.create({ ...referenceFields(r), createdById: actor.id }, { transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'create', entityType: 'reference', entityId: created.id, before: null, after: referenceDto(created) });
    return created.id;
  }
  if (d.referenceId == null) return null;
  const found = await Reference.findByPk(d.referenceId, { transaction, attributes: ['id'] });
  if (!found) throw badRequest('The draft names a reference that does not exist.', { referenceId: 'no such reference' });
  return found.id;
}

// ---------------------------------------------------------------------------------------------
// Steps

/** A new draft, version 1 of a new lineage; the material and reference may be created inline. */
export async function createDraft(d: DraftData, actor: Actor): Promise<LibrarySetDto> {
  const id = await sequelize().transaction(async (transaction) => {
    const materialId = await resolveMaterial(transaction, d, actor);
    const referenceId = await resolveReference(transaction, d, actor);
    const [newId] = await nextSetIds(transaction, 1);
    const ps = await PropertySet.create(
      {
        id: newId,
        ...valuesOf(d),
        materialId,
        referenceId,
        ...draftWorkflowColumns(actor.id, { lineageId: newId }),
      },
      { transaction },
    );
    await recordAudit(transaction, { actorId: actor.id, action: 'create', entityType: 'property-set', entityId: ps.id, before: null, after: snapshot(ps) });
    return ps.id;
  });
  return loadDto(id);
}

/** Saves a whole draft again. Only drafts; the lock version must be the current one. */
export async function updateDraft(id: number, lockVersion: number, d: DraftData, actor: Actor): Promise<LibrarySetDto> {
  await sequelize().transaction(async (transaction) => {
    const ps = await lockCurrent(PropertySet, transaction, id, lockVersion, 'Property set', 'set');
    if (ps.status !== 'draft') throw conflict(`Only drafts can be edited; this set is ${ps.status}.`, 'wrong_status');
    if (ps.supersedesId && (d.material || d.materialId !== ps.materialId)) {
      throw badRequest('A revision keeps the material of the set it revises.', {
        [d.material ? 'material' : 'materialId']: 'must stay the material of the revised set',
      });
    }
    const before = snapshot(ps);
    const materialId = await resolveMaterial(transaction, d, actor);
    const referenceId = await resolveReference(transaction, d, actor);
    const values = valuesOf(d);
    ps.set({ ...values, provenance: keepApprovals(ps, values), materialId, referenceId, lastEditedById: actor.id });
    await ps.save({ transaction }); // increments lockVersion (the model's version attribute)
    await recordAudit(transaction, { actorId: actor.id, action: 'edit', entityType: 'property-set', entityId: id, before, after: snapshot(ps) });
  });
  return loadDto(id);
}

const propertySetKind: CuratedKind<PropertySet> = {
  entityType: 'property-set',
  noun: 'property set',
  staleNoun: 'set',
  model: PropertySet,
  title: async (row) => {
    const material = await Material.findByPk(row.materialId, { attributes: ['name'] });
    return `${material?.name ?? 'Material'} — ${row.condition}`;
  },
  path: (row) => `/library/sets/${row.id}`,
  revisionOf: (ps) => ({
    materialId: ps.materialId,
    referenceId: ps.referenceId,
    condition: ps.condition,
    ...Object.fromEntries(QUANTITIES.map((q) => [q, ps[q]])),
    serviceTempMin: ps.serviceTempMin,
    serviceTempMax: ps.serviceTempMax,
    valueDetails: ps.valueDetails,
    provenance: ps.provenance,
    temperatureFactors: ps.temperatureFactors,
    sustainedLoadFactors: ps.sustainedLoadFactors,
    cyclicFactors: ps.cyclicFactors,
  }),
  async onPublish(row, actor, transaction) {
    await keepCitedVersion(row, transaction);
    const authorId = row.lastEditedById ?? row.draftedById;
    const author = authorId ? await User.findByPk(authorId, { attributes: ['id', 'name'], transaction }) : null;
    row.set({ provenance: stampConfirmations(row.provenance ?? {}, author ? { id: author.id, name: author.name } : { id: 0, name: 'unknown' }, { id: actor.id, name: actor.name }, new Date()) });
  },
  // Confirmations still waiting on a set that leaves the catalogue can no longer be decided.
  onRetire: (row, reason, actor, transaction) => closeOpenConfirmations(row.id, reason, actor, transaction),
  // Publishing or retiring changes the catalogue every process serves.
  afterCommit: () => invalidateCatalogueSnapshot(),
};

/**
 * One step of the review workflow (shared/workflows/curated.ts): submit, approve (four-eyes; a
 * set it supersedes is retired), return with a comment, revise (a new draft), retire with a reason.
 */
export async function stepSet(id: number, step: CuratedStepName, input: { lockVersion: number; comment?: string }, actor: Actor): Promise<LibrarySetDto> {
  return loadDto(await runCuratedStep(propertySetKind, id, step, input, actor));
}

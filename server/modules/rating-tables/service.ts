// Rating tables on the library desk and in the catalogue: drafting, the shared review workflow
// (server/workflows/curated-steps.ts), reading, and the published tables the engine sizes
// windows with.
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import { Material, PropertySet, RatingTable, Reference, ReferenceVersion } from '../../db/models';
import { sequelize } from '../../db/sequelize';
import { badRequest, notFound } from '../../errors';
import { recordAudit } from '../../services/audit';
import { auditSnapshot, draftWorkflowColumns, lockCurrent, runCuratedStep, type Actor, type CuratedKind } from '../../workflows/curated-steps';
import type { RatingTable as EngineRatingTable } from '../../../shared/engine';
import { ratingTableContentSchema, type RatingTableDraft, type RatingTableDto, type RatingTableListDto, type RatingTableStepInput } from '../../../shared/schemas/rating-tables';
import { curatedIdentity, reviewTrailDto, reviewTrailInclude } from '../../workflows/review-trail';
import { invalidateCatalogueSnapshot } from '../property-sets/snapshot';
import { citedVersionInclude, referenceDto } from '../property-sets/service';
import { keepCitedVersion } from '../references/versions';

export interface Caller {
  canDraft: boolean;
}

const include = () => [
  { model: Material, as: 'material', required: true },
  { model: Reference, as: 'reference' },
  citedVersionInclude(),
  ...reviewTrailInclude(),
];

/** The citation as one line, for results and records: the version a published table was approved with. */
export function citation(r: Reference | null | undefined, cited?: ReferenceVersion | null): string {
  if (!r) return 'No reference (draft)';
  const c = cited ?? r;
  return [c.authors, c.year, c.title, c.identifier, c.location].filter(Boolean).join('; ');
}

/** The current version of each covered lineage (for names on screens). */
async function coveredSets(rows: RatingTable[], transaction?: Transaction): Promise<Map<number, { propertySetId: number; condition: string }>> {
  const lineages = [...new Set(rows.flatMap((r) => r.coversLineageIds ?? []))];
  if (!lineages.length) return new Map();
  const sets = await PropertySet.findAll({
    where: { lineageId: lineages },
    attributes: ['id', 'lineageId', 'condition', 'version'],
    order: [['version', 'ASC']],
    transaction,
  });
  const out = new Map<number, { propertySetId: number; condition: string }>();
  for (const s of sets) out.set(s.lineageId!, { propertySetId: s.id, condition: s.condition });
  return out;
}

export function ratingTableDto(r: RatingTable, covered: Map<number, { propertySetId: number; condition: string }>): RatingTableDto {
  const ref = r.reference;
  return {
    ...curatedIdentity(r),
    lockVersion: r.lockVersion,
    material: { id: r.material!.id, name: r.material!.name, family: r.material!.family },
    reference: ref ? referenceDto(ref, r.citedVersion) : null,
    covers: (r.coversLineageIds ?? []).map((lineageId) => ({ lineageId, ...(covered.get(lineageId) ?? { propertySetId: lineageId, condition: `lineage ${lineageId}` }) })),
    content: {
      name: r.name,
      geometry: r.geometry,
      includedAngle: r.includedAngle ?? null,
      limits: r.limits ?? null,
      grade: r.grade,
      note: r.note,
      data: r.data,
    },
    ...reviewTrailDto(r),
    supersedesId: r.supersedesId,
    supersededById: r.supersededById,
    updatedAt: r.updatedAt.toISOString(),
  };
}

async function loadDto(id: number, caller: Caller, transaction?: Transaction): Promise<RatingTableDto> {
  const row = await RatingTable.findByPk(id, { include: include(), transaction });
  // Drafts and tables in review stay on the library desk.
  if (!row || (!caller.canDraft && (row.status === 'draft' || row.status === 'in-review'))) throw notFound('Rating table');
  return ratingTableDto(row, await coveredSets([row], transaction));
}

export const getRatingTable = (id: number, caller: Caller) => loadDto(id, caller);

export async function listRatingTables(query: { materialId?: number; status?: string }, caller: Caller): Promise<RatingTableListDto> {
  const readable = caller.canDraft ? ['draft', 'in-review', 'published', 'retired'] : ['published', 'retired'];
  const wanted = query.status === 'open' ? ['draft', 'in-review'] : query.status ? [query.status] : caller.canDraft ? readable : ['published'];
  const where: WhereOptions<RatingTable> = { status: { [Op.in]: wanted.filter((s) => readable.includes(s)) } as never };
  if (query.materialId !== undefined) Object.assign(where, { materialId: query.materialId });
  const rows = await RatingTable.findAll({ where, include: include(), order: [['name', 'ASC'], ['version', 'DESC'], ['id', 'ASC']] });
  const covered = await coveredSets(rows);
  return { items: rows.map((r) => ratingTableDto(r, covered)), total: rows.length };
}

/** Checks what a draft names exists and fits: the material, the reference, the covered lineages of that material. */
async function resolveDraft(transaction: Transaction, d: RatingTableDraft): Promise<void> {
  const material = await Material.findByPk(d.materialId, { transaction, attributes: ['id'] });
  if (!material) throw badRequest('The draft names a material that does not exist.', { materialId: 'No such material.' });
  if (d.referenceId != null && !(await Reference.findByPk(d.referenceId, { transaction, attributes: ['id'] }))) {
    throw badRequest('The draft names a reference that does not exist.', { referenceId: 'No such reference.' });
  }
  if (d.coversLineageIds.length) {
    const found = await PropertySet.findAll({ where: { lineageId: d.coversLineageIds, materialId: d.materialId }, attributes: ['lineageId'], transaction });
    const known = new Set(found.map((s) => s.lineageId));
    const fields: Record<string, string> = {};
    d.coversLineageIds.forEach((l, i) => {
      if (!known.has(l)) fields[`coversLineageIds.${i}`] = 'Not a property set of this material.';
    });
    if (Object.keys(fields).length) throw badRequest('The table covers property sets of another material, or none.', fields);
  }
}

const valuesOf = (d: RatingTableDraft) => ({
  materialId: d.materialId,
  referenceId: d.referenceId ?? null,
  coversLineageIds: [...new Set(d.coversLineageIds)].sort((a, b) => a - b),
  name: d.content.name,
  geometry: d.content.geometry,
  includedAngle: d.content.includedAngle ?? null,
  limits: d.content.limits ?? null,
  grade: d.content.grade,
  note: d.content.note ?? null,
  data: d.content.data,
});

export async function createRatingTableDraft(d: RatingTableDraft, actor: Actor): Promise<RatingTableDto> {
  const id = await sequelize().transaction(async (transaction) => {
    await resolveDraft(transaction, d);
    const row = await RatingTable.create(
      {
        ...valuesOf(d),
        ...draftWorkflowColumns(actor.id),
      },
      { transaction },
    );
    await row.update({ lineageId: row.id }, { transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'create', entityType: 'rating-table', entityId: row.id, before: null, after: auditSnapshot(row) });
    return row.id;
  });
  return loadDto(id, { canDraft: true });
}

export async function updateRatingTableDraft(id: number, lockVersion: number, d: RatingTableDraft, actor: Actor): Promise<RatingTableDto> {
  await sequelize().transaction(async (transaction) => {
    const row = await lockCurrent(RatingTable, transaction, id, lockVersion, 'Rating table');
    if (row.status !== 'draft') throw badRequest(`Only drafts can be edited; this table is ${row.status}.`, undefined, 'wrong_status');
    if (row.supersedesId && d.materialId !== row.materialId) {
      throw badRequest('A revision keeps the material of the table it revises.', { materialId: 'Must stay the material of the revised table.' });
    }
    await resolveDraft(transaction, d);
    const before = auditSnapshot(row);
    row.set({ ...valuesOf(d), lastEditedById: actor.id });
    await row.save({ transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'edit', entityType: 'rating-table', entityId: id, before, after: auditSnapshot(row) });
  });
  return loadDto(id, { canDraft: true });
}

const ratingTableKind: CuratedKind<RatingTable> = {
  entityType: 'rating-table',
  noun: 'rating table',
  model: RatingTable,
  title: async (row) => {
    const material = await Material.findByPk(row.materialId, { attributes: ['name'] });
    return `${row.name} (${material?.name ?? 'material'})`;
  },
  path: (row) => `/library/rating-tables/${row.id}`,
  async checkPublishable(row) {
    // Tables drafted before a schema rule tightened are checked again before they reach the engine.
    const check = ratingTableContentSchema.safeParse({ name: row.name, geometry: row.geometry, includedAngle: row.includedAngle, limits: row.limits, grade: row.grade, note: row.note, data: row.data });
    if (!check.success) throw badRequest('The table does not pass the rating-table rules; return it to the author.', { data: check.error.issues[0]?.message ?? 'invalid' });
  },
  revisionOf: (row) => ({
    materialId: row.materialId,
    referenceId: row.referenceId,
    coversLineageIds: row.coversLineageIds,
    name: row.name,
    geometry: row.geometry,
    includedAngle: row.includedAngle,
    limits: row.limits,
    grade: row.grade,
    note: row.note,
    data: row.data,
  }),
  onPublish: (row, _actor, transaction) => keepCitedVersion(row, transaction),
  afterCommit: () => invalidateCatalogueSnapshot(),
};

export async function stepRatingTable(id: number, input: RatingTableStepInput, actor: Actor): Promise<RatingTableDto> {
  const resultId = await runCuratedStep(ratingTableKind, id, input.step, { lockVersion: input.lockVersion, comment: 'comment' in input ? input.comment : undefined }, actor);
  return loadDto(resultId, { canDraft: true });
}

// ---------------------------------------------------------------------------------------------
// For the engine: published tables, and which property sets they cover

export interface PublishedRatingTable {
  materialId: number;
  /** Empty: every set of the material. */
  coversLineageIds: readonly number[];
  table: EngineRatingTable;
}

export async function publishedRatingTables(): Promise<PublishedRatingTable[]> {
  const rows = await RatingTable.findAll({ where: { status: 'published' }, include: [{ model: Reference, as: 'reference' }, citedVersionInclude()], order: [['id', 'ASC']] });
  return rows.map((r) => ({
    materialId: r.materialId,
    coversLineageIds: r.coversLineageIds ?? [],
    table: {
      id: r.id,
      version: r.version,
      name: r.name,
      geometry: r.geometry,
      includedAngle: r.includedAngle ?? null,
      limits: r.limits ?? null,
      source: citation(r.reference, r.citedVersion),
      data: r.data,
    },
  }));
}

/** The published tables that cover a property set (by its material and lineage). */
export function tablesCovering(tables: readonly PublishedRatingTable[], materialId: number, lineageId: number): EngineRatingTable[] {
  return tables.filter((t) => t.materialId === materialId && (t.coversLineageIds.length === 0 || t.coversLineageIds.includes(lineageId))).map((t) => t.table);
}

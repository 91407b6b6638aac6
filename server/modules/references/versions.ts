// Versions of a reference's citation. A reference is edited in place until something published
// first cites it; then its current content is frozen as a version row, published records point at
// that row, and a change is a new version reviewed by someone else (shared/workflows/
// reference-version.ts, run by the curated step runner). Approving it copies the new content onto
// the reference, which drafts cite; published and retired records keep the version they cite.
import { Op, UniqueConstraintError, type Transaction } from 'sequelize';
import { Reference, ReferenceVersion } from '../../db/models';
import type { CuratedModel } from '../../db/models/columns';
import { sequelize } from '../../db/sequelize';
import { badRequest, conflict, notFound } from '../../errors';
import { recordAudit } from '../../services/audit';
import { auditSnapshot, lockCurrent } from '../../services/optimistic-lock';
import { reviewTrailDto, reviewTrailInclude } from '../../workflows/review-trail';
import { runCuratedStep, type Actor, type CuratedKind } from '../../workflows/curated-steps';
import { REFERENCE_VERSION_STEPS } from '../../../shared/workflows/reference-version';
import type { ReferenceInput } from '../../../shared/schemas/catalogue';
import type { PendingReferenceVersionDto, ReferenceCitationDto, ReferenceVersionDto, ReferenceVersionStepInput, ValueChangeDto } from '../../../shared/schemas/library';
import { invalidateCatalogueSnapshot } from '../property-sets/snapshot';
import { referenceDto } from '../property-sets/service';

export const CITATION_FIELDS = ['kind', 'title', 'authors', 'year', 'identifier', 'location', 'note'] as const;

/** The citation fields of a reference or one of its versions. */
export const citationOf = (r: Reference | ReferenceVersion): ReferenceCitationDto => ({
  kind: r.kind,
  title: r.title,
  authors: r.authors,
  year: r.year,
  identifier: r.identifier,
  location: r.location,
  note: r.note,
});

/**
 * An input's citation fields as stored (absent: null): a reference's own fields and a version's
 * alike (the desk, the CSV import, the reference page and a proposed change write them so).
 */
export const citationFromInput = (input: Pick<ReferenceInput, 'kind' | 'title'> & Partial<ReferenceInput>): ReferenceCitationDto => ({
  kind: input.kind,
  title: input.title,
  authors: input.authors ?? null,
  year: input.year ?? null,
  identifier: input.identifier ?? null,
  location: input.location ?? null,
  note: input.note ?? null,
});

export function citationChanges(before: ReferenceCitationDto, after: ReferenceCitationDto): ValueChangeDto[] {
  return CITATION_FIELDS.filter((f) => before[f] !== after[f]).map((field) => ({ field, before: before[field], after: after[field] }));
}

export function versionDto(row: ReferenceVersion, previous: ReferenceVersion | null | undefined): ReferenceVersionDto {
  return {
    id: row.id,
    referenceId: row.referenceId,
    version: row.version,
    status: row.status,
    citation: citationOf(row),
    lockVersion: row.lockVersion,
    ...reviewTrailDto(row),
    retiredAt: row.retiredAt?.toISOString() ?? null,
    updatedAt: row.updatedAt.toISOString(),
    changes: previous ? citationChanges(citationOf(previous), citationOf(row)) : [],
  };
}


/** Every version of a reference, newest first; proposed changes only for those who may draft. */
export async function versionsOf(referenceId: number, canDraft: boolean): Promise<ReferenceVersionDto[]> {
  const rows = await ReferenceVersion.findAll({
    where: { referenceId, ...(canDraft ? {} : { status: ['published', 'retired'] }) },
    include: reviewTrailInclude(),
    order: [['version', 'DESC']],
  });
  const byId = new Map(rows.map((r) => [r.id, r]));
  return rows.map((r) => versionDto(r, r.supersedesId ? byId.get(r.supersedesId) : null));
}

/** The references among `ids` that are in use: cited by something published, so frozen as versions. */
export async function inUseIds(ids: number[], transaction?: Transaction): Promise<Set<number>> {
  if (!ids.length) return new Set();
  const rows = await ReferenceVersion.findAll({ where: { referenceId: ids, status: 'published' }, attributes: ['referenceId'], transaction });
  return new Set(rows.map((r) => r.referenceId));
}

/** SQL for the ids of references in use, for a WHERE … IN. */
export const IN_USE_SQL = `(SELECT reference_id FROM reference_versions WHERE status = 'published')`;

/** On publishing a record that cites a reference: it keeps the version it was approved with (citedVersionId), until revised. */
export async function keepCitedVersion(row: CuratedModel, transaction: Transaction): Promise<void> {
  row.set({ referenceVersionId: row.referenceId ? await citedVersionId(row.referenceId, transaction) : null });
}

/**
 * The id of the version row of `referenceId`'s current citation, which a record being published
 * will cite. The first time, this freezes the reference: its content becomes version row 1 and
 * from then on a change goes through review. Locks the reference row, so an edit in place cannot
 * slip in between.
 */
export async function citedVersionId(referenceId: number, transaction: Transaction): Promise<number> {
  const ref = await Reference.findByPk(referenceId, { transaction, lock: transaction.LOCK.UPDATE });
  if (!ref) throw badRequest('The record names a reference that does not exist.', { referenceId: 'no such reference' });
  const current = await ReferenceVersion.findOne({ where: { referenceId, version: ref.version }, attributes: ['id'], transaction });
  if (current) return current.id;
  const [rows] = await sequelize().query(`SELECT nextval(pg_get_serial_sequence('reference_versions', 'id'))::integer AS id`, { transaction });
  const id = (rows as { id: number }[])[0].id;
  await ReferenceVersion.create(
    {
      id,
      lineageId: id,
      referenceId,
      version: ref.version,
      ...citationOf(ref),
      status: 'published',
      supersedesId: null,
      draftedById: ref.createdById ?? null,
      lastEditedById: ref.createdById ?? null,
      publishedAt: new Date(),
    },
    { transaction },
  );
  return id;
}

/** The open proposed change of a reference, if any. */
export const openVersion = (referenceId: number, transaction?: Transaction) =>
  ReferenceVersion.findOne({ where: { referenceId, status: ['draft', 'in-review'] }, transaction });

const changeOpen = (v: ReferenceVersion) =>
  conflict(`This reference already has a proposed change (version ${v.version}, ${v.status === 'draft' ? 'a draft' : 'in review'}). Edit or review that one instead of starting another.`, 'revision_open');

/**
 * A change to a reference in use (locked by the caller): a new draft version with the input's
 * content, superseding the published one. 409 when a change is already open; 400 when the input
 * changes nothing.
 */
export async function proposeChange(ref: Reference, input: ReferenceInput, actor: { id: number }, transaction: Transaction): Promise<number> {
  const open = await openVersion(ref.id, transaction);
  if (open) throw changeOpen(open);
  const current = await ReferenceVersion.findOne({ where: { referenceId: ref.id, status: 'published' }, transaction });
  if (!current) throw new Error(`reference ${ref.id} is in use but has no published version`);
  const citation = citationFromInput(input);
  if (!citationChanges(citationOf(current), citation).length) {
    throw badRequest('This is the citation as published; change a field to propose a new version.', { reference: 'changes nothing' });
  }
  const latest = (await ReferenceVersion.max<number, ReferenceVersion>('version', { where: { referenceId: ref.id }, transaction })) ?? current.version;
  try {
    const row = await ReferenceVersion.create(
      {
        referenceId: ref.id,
        version: latest + 1,
        ...citation,
        status: 'draft',
        lineageId: current.lineageId ?? current.id,
        supersedesId: current.id,
        draftedById: actor.id,
        lastEditedById: actor.id,
      },
      { transaction },
    );
    await recordAudit(transaction, { actorId: actor.id, action: 'propose', entityType: 'reference-version', entityId: row.id, before: null, after: auditSnapshot(row) });
    return row.id;
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw conflict('Someone proposed a change to this reference at the same moment. Reload to see it.', 'revision_open');
    throw err;
  }
}

/** The version row `version` of reference `referenceId`, or 404. */
async function versionRow(referenceId: number, version: number, transaction?: Transaction): Promise<ReferenceVersion> {
  const row = await ReferenceVersion.findOne({ where: { referenceId, version }, attributes: ['id'], transaction });
  if (!row) throw notFound('Version of the reference');
  return row;
}

/** Saves a proposed change again (drafts only; the lock version must be the current one). */
export async function updateProposedVersion(referenceId: number, version: number, lockVersion: number, input: ReferenceInput, actor: Actor): Promise<void> {
  await sequelize().transaction(async (transaction) => {
    const { id } = await versionRow(referenceId, version, transaction);
    const row = await lockCurrent(ReferenceVersion, transaction, id, lockVersion, 'Version of the reference', 'proposed change');
    if (row.status !== 'draft') throw conflict(`Only a proposed change in draft can be edited; this one is ${row.status}.`, 'wrong_status');
    const before = auditSnapshot(row);
    row.set({ ...citationFromInput(input), lastEditedById: actor.id });
    await row.save({ transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'edit', entityType: 'reference-version', entityId: row.id, before, after: auditSnapshot(row) });
  });
}

const referenceVersionKind: CuratedKind<ReferenceVersion> = {
  entityType: 'reference-version',
  noun: 'reference change',
  model: ReferenceVersion,
  steps: REFERENCE_VERSION_STEPS,
  title: async (row) => `reference “${row.title}”`,
  path: (row) => `/library/references/${row.referenceId}`,
  revisionOf: (row) => ({ ...citationOf(row) }),
  // Approval publishes the new citation: the reference takes its content and number, so drafts
  // cite it from now on; records published with the earlier version keep pointing at that one.
  async onPublish(row, actor, transaction) {
    const ref = await lockCurrent(Reference, transaction, row.referenceId, null, 'Reference');
    const before = referenceDto(ref);
    ref.set({ ...citationOf(row), version: row.version });
    await ref.save({ transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'publish-version', entityType: 'reference', entityId: ref.id, before, after: { ...referenceDto(ref), versionId: row.id } });
  },
  // Sets show their reference's current version beside the one they cite.
  afterCommit: () => invalidateCatalogueSnapshot(),
};

/** Submits, approves (four-eyes) or returns a proposed change to a reference. */
export async function stepReferenceVersion(referenceId: number, version: number, input: ReferenceVersionStepInput, actor: Actor): Promise<void> {
  const { id } = await versionRow(referenceId, version);
  await runCuratedStep(referenceVersionKind, id, input.step, { lockVersion: input.lockVersion, comment: 'comment' in input ? input.comment : undefined }, actor);
}

/** Proposed changes waiting on the desk (draft and in review, or one of them), oldest submission first. */
export async function listProposedVersions(query: { status?: 'draft' | 'in-review' }): Promise<PendingReferenceVersionDto[]> {
  const rows = await ReferenceVersion.findAll({
    where: { status: query.status ? [query.status] : ['draft', 'in-review'] },
    include: [...reviewTrailInclude(), { model: Reference, as: 'reference', required: true }],
    order: [
      ['submittedAt', 'ASC NULLS LAST'],
      ['id', 'ASC'],
    ],
    limit: 500,
  });
  const previous = new Map(
    (await ReferenceVersion.findAll({ where: { id: { [Op.in]: rows.map((r) => r.supersedesId).filter((v): v is number => v !== null) } } })).map((r) => [r.id, r]),
  );
  return rows.map((r) => {
    const ref = r.reference!;
    return { ...versionDto(r, r.supersedesId ? previous.get(r.supersedesId) : null), current: { ...citationOf(ref), version: ref.version } };
  });
}

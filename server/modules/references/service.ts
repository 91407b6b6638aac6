// References (the sources of property sets and rating tables), their versions and their uploaded
// documents. A reference cited only by drafts is edited in place and seen by librarians and
// administrators only; once something published cites it, it is in use: everyone signed in may
// read it, and a change is a reviewed new version (versions.ts). Every upload is a new document
// version: stored in the object store first and recorded after (a failed record deletes the new
// object), and no version is ever deleted, so a design record's document stays downloadable.
import { randomBytes } from 'node:crypto';
import type { Readable } from 'node:stream';
import { Op, literal, type WhereOptions } from 'sequelize';
import { PropertySet, RatingTable, Reference, ReferenceDocument, User } from '../../db/models';
import { sequelize } from '../../db/sequelize';
import { AppError, badRequest, notFound } from '../../errors';
import { recordAudit } from '../../services/audit';
import { lockCurrent } from '../../services/optimistic-lock';
import { deleteDocument, getDocument, putDocument } from '../../services/storage';
import { isPdf, safeStoredName } from '../../services/pdf-check';
import type { ReferenceInput } from '../../../shared/schemas/catalogue';
import type { ReferenceDetailDto, ReferenceDocumentDto, ReferenceListDto, ReferencePageDto } from '../../../shared/schemas/library';
import type { ItemsDto } from '../../../shared/schemas/responses';
import { referenceDto } from '../property-sets/service';
import { invalidateCatalogueSnapshot } from '../property-sets/snapshot';
import { IN_USE_SQL, citationFromInput, inUseIds, proposeChange, versionsOf } from './versions';

export interface Actor {
  id: number;
  name?: string;
}

/** Who reads: librarians and administrators (who may draft) see references not yet in use. */
export interface Viewer {
  canDraft: boolean;
}

const DRAFTER: Viewer = { canDraft: true };

export function referenceDetailDto(r: Reference, usedBy: number, inUse: boolean): ReferenceDetailDto {
  return {
    ...referenceDto(r),
    version: r.version,
    lockVersion: r.lockVersion,
    document:
      r.documentKey && r.documentName && r.documentUploadedAt && r.documentVersion
        ? { name: r.documentName, size: Number(r.documentSize ?? 0), uploadedAt: r.documentUploadedAt.toISOString(), version: r.documentVersion }
        : null,
    usedBy,
    inUse,
  };
}

/** How many property sets and rating tables cite each reference. */
async function usedByCounts(ids: number[]): Promise<Map<number, number>> {
  if (!ids.length) return new Map();
  const out = new Map<number, number>();
  for (const model of [PropertySet, RatingTable] as const) {
    const rows = (await (model as typeof PropertySet).count({ where: { referenceId: ids }, group: ['referenceId'] })) as unknown as {
      referenceId: number;
      count: number | string;
    }[];
    for (const r of rows) out.set(Number(r.referenceId), (out.get(Number(r.referenceId)) ?? 0) + Number(r.count));
  }
  return out;
}

const escapeLike = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

/** Every word of q must appear in the title, authors or identifier. By title. Only references in use for those who cannot draft. */
export async function listReferences(query: { q?: string }, viewer: Viewer): Promise<ReferenceListDto> {
  const where: WhereOptions<Reference>[] = [];
  if (!viewer.canDraft) where.push({ id: { [Op.in]: literal(IN_USE_SQL) } });
  for (const word of (query.q ?? '').split(/\s+/).filter(Boolean).slice(0, 8)) {
    const like = { [Op.iLike]: `%${escapeLike(word)}%` };
    where.push({ [Op.or]: [{ title: like }, { authors: like }, { identifier: like }] });
  }
  const rows = await Reference.findAll({ where: { [Op.and]: where }, order: [['title', 'ASC'], ['id', 'ASC']] });
  const ids = rows.map((r) => r.id);
  const [counts, inUse] = await Promise.all([usedByCounts(ids), inUseIds(ids)]);
  return { items: rows.map((r) => referenceDetailDto(r, counts.get(r.id) ?? 0, inUse.has(r.id))), total: rows.length };
}

/** The reference if this viewer may see it (404 otherwise: a draft's source is the desk's business). */
async function visibleReference(id: number, viewer: Viewer): Promise<{ reference: Reference; inUse: boolean }> {
  const reference = await Reference.findByPk(id);
  if (!reference) throw notFound('Reference');
  const inUse = (await inUseIds([id])).has(id);
  if (!inUse && !viewer.canDraft) throw notFound('Reference');
  return { reference, inUse };
}

const documentDto = (d: ReferenceDocument): ReferenceDocumentDto => ({
  version: d.version,
  name: d.name,
  size: d.size,
  uploadedAt: d.uploadedAt.toISOString(),
  uploadedBy: d.uploadedBy ? { id: d.uploadedBy.id, name: d.uploadedBy.name } : null,
});

async function documentsOf(referenceId: number): Promise<ReferenceDocumentDto[]> {
  const rows = await ReferenceDocument.findAll({
    where: { referenceId },
    include: [{ model: User, as: 'uploadedBy', attributes: ['id', 'name'] }],
    order: [['version', 'DESC']],
  });
  return rows.map(documentDto);
}

/** One reference with its versions (a proposed change for those who may draft) and its documents. */
export async function getReference(id: number, viewer: Viewer): Promise<ReferencePageDto> {
  const { reference, inUse } = await visibleReference(id, viewer);
  const [counts, versions, documents] = await Promise.all([usedByCounts([id]), versionsOf(id, viewer.canDraft), documentsOf(id)]);
  return {
    ...referenceDetailDto(reference, counts.get(id) ?? 0, inUse),
    versions,
    pending: versions.find((v) => v.status === 'draft' || v.status === 'in-review') ?? null,
    documents,
  };
}

/** A reference's own fields from an input: its citation (see citationFromInput). */
export const referenceFields = citationFromInput;

export async function createReference(input: ReferenceInput, actor: Actor): Promise<ReferencePageDto> {
  const id = await sequelize().transaction(async (transaction) => {
    const r = await Reference.create({ ...referenceFields(input), createdById: actor.id }, { transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'create', entityType: 'reference', entityId: r.id, before: null, after: referenceDto(r) });
    return r.id;
  });
  return getReference(id, DRAFTER);
}

/**
 * A librarian's change to a reference; 409 "stale" when someone saved it since lockVersion. Not in
 * use: the fields are replaced. In use: the change becomes a proposed new version (`proposed`),
 * and the published citation stays as it is until someone else approves it.
 */
export async function updateReference(id: number, lockVersion: number, input: ReferenceInput, actor: Actor): Promise<{ proposed: boolean; reference: ReferencePageDto }> {
  const proposed = await sequelize().transaction(async (transaction) => {
    const r = await lockCurrent(Reference, transaction, id, lockVersion, 'Reference', 'reference');
    if ((await inUseIds([id], transaction)).has(id)) {
      await proposeChange(r, input, actor, transaction);
      return true;
    }
    const before = referenceDto(r);
    r.set(referenceFields(input));
    await r.save({ transaction }); // increments lockVersion (the model's version attribute)
    await recordAudit(transaction, { actorId: actor.id, action: 'edit', entityType: 'reference', entityId: id, before, after: referenceDto(r) });
    return false;
  });
  return { proposed, reference: await getReference(id, DRAFTER) };
}

// ---------------------------------------------------------------------------------------------
// Documents

export interface UploadedDocument {
  buffer: Buffer;
  originalname: string;
  size: number;
}

const documentState = (r: Reference) =>
  r.documentKey
    ? { key: r.documentKey, name: r.documentName, size: r.documentSize, version: r.documentVersion, uploadedAt: r.documentUploadedAt?.toISOString() ?? null }
    : null;

/**
 * Stores a PDF as the next document version of a reference; earlier versions stay. Order: check
 * the bytes, put the object under a new key, record the version and point the reference at it in
 * one transaction (deleting the object if that fails).
 */
export async function uploadDocument(id: number, file: UploadedDocument, actor: Actor): Promise<ReferencePageDto> {
  if (!(await Reference.count({ where: { id } }))) throw notFound('Reference');
  if (file.buffer.length === 0) throw badRequest('The file is empty.', { file: 'is empty' });
  if (!isPdf(file.buffer)) {
    throw new AppError(400, 'not_pdf', 'Only PDF documents can be uploaded, and this file is not a PDF.', { file: 'must be a PDF' });
  }
  const name = safeStoredName(file.originalname || 'document.pdf');
  const storedName = /\.pdf$/i.test(name) ? name : `${name}.pdf`;
  // A new key for every upload: no version's object is ever overwritten.
  const key = `references/${id}/${Date.now().toString(36)}-${randomBytes(6).toString('hex')}-${storedName}`;
  await putDocument({ key, body: file.buffer, contentType: 'application/pdf' });

  try {
    await sequelize().transaction(async (transaction) => {
      const r = await Reference.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!r) throw notFound('Reference');
      const before = documentState(r);
      const version = ((await ReferenceDocument.max<number, ReferenceDocument>('version', { where: { referenceId: id }, transaction })) ?? 0) + 1;
      const uploadedAt = new Date();
      await ReferenceDocument.create({ referenceId: id, version, storageKey: key, name: storedName, size: file.buffer.length, uploadedById: actor.id, uploadedAt }, { transaction });
      // A static update: the document is not one of the fields an edit form holds, so it does
      // not make someone's open edit of the reference stale.
      await Reference.update(
        { documentKey: key, documentName: storedName, documentSize: file.buffer.length, documentUploadedAt: uploadedAt, documentVersion: version },
        { where: { id }, transaction },
      );
      await r.reload({ transaction });
      await recordAudit(transaction, { actorId: actor.id, action: 'upload', entityType: 'reference', entityId: id, before: { document: before }, after: { document: documentState(r) } });
    });
  } catch (err) {
    await deleteDocument(key).catch((cleanupErr: unknown) =>
      console.error(`[isobath] upload: could not delete the unrecorded object ${key}:`, cleanupErr),
    );
    throw err;
  }
  // Sets carry their reference's latest document version.
  invalidateCatalogueSnapshot();
  return getReference(id, DRAFTER);
}

/** Every document version of a reference, newest first. */
export async function listDocuments(id: number, viewer: Viewer): Promise<ItemsDto<ReferenceDocumentDto>> {
  await visibleReference(id, viewer);
  return { items: await documentsOf(id) };
}

export interface DocumentDownload {
  stream: Readable;
  name: string;
  size: number | undefined;
}

/** Opens a document of a reference for streaming: version `version`, or the latest; 404 when there is none. */
export async function openDocument(id: number, version: number | undefined, viewer: Viewer): Promise<DocumentDownload> {
  const { reference } = await visibleReference(id, viewer);
  const wanted = version ?? reference.documentVersion;
  const doc = wanted ? await ReferenceDocument.findOne({ where: { referenceId: id, version: wanted } }) : null;
  if (!doc) throw notFound(version ? `Version ${version} of the document of this reference` : 'The document of this reference');
  const stored = await getDocument(doc.storageKey);
  return { stream: stored.stream, name: doc.name, size: stored.contentLength ?? doc.size };
}

// References (the sources of property sets) and their uploaded documents. A document is stored
// in the object store first and recorded on the row after; a failed record deletes the object,
// so no refused or interrupted upload leaves anything behind.
import { randomBytes } from 'node:crypto';
import type { Readable } from 'node:stream';
import { Op, type WhereOptions } from 'sequelize';
import { PropertySet, RatingTable, Reference } from '../../db/models';
import { sequelize } from '../../db/sequelize';
import { AppError, badRequest, conflict, notFound } from '../../errors';
import { recordAudit } from '../../services/audit';
import { deleteDocument, getDocument, putDocument } from '../../services/storage';
import { isPdf, safeStoredName } from '../../services/pdf-check';
import type { ReferenceInput } from '../../../shared/schemas/catalogue';
import type { ReferenceDetailDto, ReferenceListDto } from '../../../shared/schemas/library';
import { referenceDto } from '../property-sets/service';

export interface Actor {
  id: number;
}

export function referenceDetailDto(r: Reference, usedBy: number): ReferenceDetailDto {
  return {
    ...referenceDto(r),
    lockVersion: r.lockVersion,
    document:
      r.documentKey && r.documentName && r.documentUploadedAt
        ? { name: r.documentName, size: Number(r.documentSize ?? 0), uploadedAt: r.documentUploadedAt.toISOString() }
        : null,
    usedBy,
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

/** Every word of q must appear in the title, authors or identifier. By title. */
export async function listReferences(query: { q?: string }): Promise<ReferenceListDto> {
  const where: WhereOptions<Reference>[] = [];
  for (const word of (query.q ?? '').split(/\s+/).filter(Boolean).slice(0, 8)) {
    const like = { [Op.iLike]: `%${escapeLike(word)}%` };
    where.push({ [Op.or]: [{ title: like }, { authors: like }, { identifier: like }] });
  }
  const rows = await Reference.findAll({ where: { [Op.and]: where }, order: [['title', 'ASC'], ['id', 'ASC']] });
  const counts = await usedByCounts(rows.map((r) => r.id));
  return { items: rows.map((r) => referenceDetailDto(r, counts.get(r.id) ?? 0)), total: rows.length };
}

export async function getReference(id: number): Promise<ReferenceDetailDto> {
  const r = await Reference.findByPk(id);
  if (!r) throw notFound('Reference');
  const counts = await usedByCounts([id]);
  return referenceDetailDto(r, counts.get(id) ?? 0);
}

/** A reference's own fields from an input (the desk, the CSV import and the reference page write them alike). */
export const referenceFields = (input: Pick<ReferenceInput, 'kind' | 'title'> & Partial<ReferenceInput>) => ({
  kind: input.kind,
  title: input.title,
  authors: input.authors ?? null,
  year: input.year ?? null,
  identifier: input.identifier ?? null,
  location: input.location ?? null,
  note: input.note ?? null,
});

export async function createReference(input: ReferenceInput, actor: Actor): Promise<ReferenceDetailDto> {
  const id = await sequelize().transaction(async (transaction) => {
    const r = await Reference.create({ ...referenceFields(input), createdById: actor.id }, { transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'create', entityType: 'reference', entityId: r.id, before: null, after: referenceDto(r) });
    return r.id;
  });
  return getReference(id);
}

/** Replaces the reference's fields; 409 "stale" when someone saved it since lockVersion. */
export async function updateReference(id: number, lockVersion: number, input: ReferenceInput, actor: Actor): Promise<ReferenceDetailDto> {
  await sequelize().transaction(async (transaction) => {
    const r = await Reference.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!r) throw notFound('Reference');
    if (r.lockVersion !== lockVersion) {
      throw conflict('Someone saved this reference after you opened it. Reload to see their changes; your edits are still in the form.', 'stale');
    }
    const before = referenceDto(r);
    r.set(referenceFields(input));
    await r.save({ transaction }); // increments lockVersion (the model's version attribute)
    await recordAudit(transaction, { actorId: actor.id, action: 'edit', entityType: 'reference', entityId: id, before, after: referenceDto(r) });
  });
  return getReference(id);
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
    ? { key: r.documentKey, name: r.documentName, size: r.documentSize, uploadedAt: r.documentUploadedAt?.toISOString() ?? null }
    : null;

/**
 * Stores a PDF for a reference, replacing any previous one. Order: check the bytes, put the
 * object under a new key, record it on the row in a transaction (deleting the object if that
 * fails), and only after the commit delete the object it replaced.
 */
export async function uploadDocument(id: number, file: UploadedDocument, actor: Actor): Promise<ReferenceDetailDto> {
  if (!(await Reference.count({ where: { id } }))) throw notFound('Reference');
  if (file.buffer.length === 0) throw badRequest('The file is empty.', { file: 'is empty' });
  if (!isPdf(file.buffer)) {
    throw new AppError(400, 'not_pdf', 'Only PDF documents can be uploaded, and this file is not a PDF.', { file: 'must be a PDF' });
  }
  const name = safeStoredName(file.originalname || 'document.pdf');
  const storedName = /\.pdf$/i.test(name) ? name : `${name}.pdf`;
  // A new key for every upload: the previous document stays intact until the new one is recorded.
  const key = `references/${id}/${Date.now().toString(36)}-${randomBytes(6).toString('hex')}-${storedName}`;
  await putDocument({ key, body: file.buffer, contentType: 'application/pdf' });

  let replacedKey: string | null = null;
  try {
    await sequelize().transaction(async (transaction) => {
      const r = await Reference.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!r) throw notFound('Reference');
      const before = documentState(r);
      replacedKey = r.documentKey;
      // A static update: the document is not one of the fields an edit form holds, so it does
      // not make someone's open edit of the reference stale.
      await Reference.update(
        { documentKey: key, documentName: storedName, documentSize: file.buffer.length, documentUploadedAt: new Date() },
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
  if (replacedKey && replacedKey !== key) {
    const old = replacedKey;
    await deleteDocument(old).catch((cleanupErr: unknown) =>
      console.error(`[isobath] upload: could not delete the replaced object ${old}:`, cleanupErr),
    );
  }
  return getReference(id);
}

export interface DocumentDownload {
  stream: Readable;
  name: string;
  size: number | undefined;
}

/** Opens a reference's document for streaming; 404 when it has none. */
export async function openDocument(id: number): Promise<DocumentDownload> {
  const r = await Reference.findByPk(id, { attributes: ['id', 'documentKey', 'documentName', 'documentSize'] });
  if (!r) throw notFound('Reference');
  if (!r.documentKey || !r.documentName) throw notFound('The document of this reference');
  const doc = await getDocument(r.documentKey);
  return { stream: doc.stream, name: r.documentName, size: doc.contentLength ?? r.documentSize ?? undefined };
}

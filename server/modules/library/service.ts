// The library desk: drafting property sets, four-eyes review, revisions that supersede a
// published version, and retirement. Every step runs in one transaction with a row lock, checks
// the caller's lock version, and writes an audit entry; e-mails go out after the commit.
import { Op, UniqueConstraintError, type Transaction, type WhereOptions } from 'sequelize';
import { Material, PropertySet, Reference, User } from '../../db/models';
import { sequelize } from '../../db/sequelize';
import { env } from '../../config/env';
import { AppError, badRequest, conflict, notFound } from '../../errors';
import { recordAudit } from '../../services/audit';
import { sendMailSafely } from '../../services/mail';
import { QUANTITIES } from '../../../shared/schemas/catalogue';
import type { DraftData, LibrarySetDto, LibrarySetListDto, SetChangesDto, ValueChangeDto } from '../../../shared/schemas/library';
import { createMaterialIn, include, librarySetDto, referenceDto } from '../property-sets/service';
import { invalidateCatalogueSnapshot } from '../property-sets/snapshot';

export interface Actor {
  id: number;
  name: string;
}

// ---------------------------------------------------------------------------------------------
// Errors in the contract's words

export const STALE_MESSAGE =
  'Someone saved this set after you opened it. Reload to see their changes; your edits are still in the form.';
export const stale = (message = STALE_MESSAGE) => conflict(message, 'stale');
const wrongStatus = (message: string) => conflict(message, 'wrong_status');
const ownWork = (what: string) =>
  new AppError(403, 'own_work', `You drafted or last edited this set, so another librarian must ${what} it (four-eyes rule).`);
const revisionOpen = () =>
  conflict('This set already has a revision in draft or in review. Open that one instead of starting another.', 'revision_open');

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

/** Reads the row with SELECT … FOR UPDATE, so concurrent steps on one set run one after another. */
async function lockSet(transaction: Transaction, id: number): Promise<PropertySet> {
  const ps = await PropertySet.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
  if (!ps) throw notFound('Property set');
  return ps;
}

function assertCurrent(ps: PropertySet, lockVersion: number): void {
  if (ps.lockVersion !== lockVersion) throw stale();
}

/** The row as stored, for the audit log's before/after. */
function snapshot(ps: PropertySet): Record<string, unknown> {
  const { createdAt: _c, updatedAt: _u, ...rest } = ps.get({ plain: true }) as Record<string, unknown>;
  return rest;
}

/** A new id from the table's sequence, so a new lineage can be its own first id in one insert. */
async function nextSetIds(transaction: Transaction, count: number): Promise<number[]> {
  const [rows] = await sequelize().query(
    `SELECT nextval(pg_get_serial_sequence('property_sets', 'id'))::integer AS id FROM generate_series(1, :count)`,
    { transaction, replacements: { count } },
  );
  return (rows as { id: number }[]).map((r) => r.id);
}

function valuesOf(d: DraftData) {
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
    const created = await Reference.create(
      {
        kind: r.kind,
        title: r.title,
        authors: r.authors ?? null,
        year: r.year ?? null,
        identifier: r.identifier ?? null,
        location: r.location ?? null,
        note: r.note ?? null,
        createdById: actor.id,
      },
      { transaction },
    );
    await recordAudit(transaction, { actorId: actor.id, action: 'create', entityType: 'reference', entityId: created.id, before: null, after: referenceDto(created) });
    return created.id;
  }
  if (d.referenceId == null) return null;
  const found = await Reference.findByPk(d.referenceId, { transaction, attributes: ['id'] });
  if (!found) throw badRequest('The draft names a reference that does not exist.', { referenceId: 'no such reference' });
  return found.id;
}

/** A one-line subject of at most 200 characters (the mail service refuses longer). */
function subject(text: string): string {
  const line = text.replace(/\s+/g, ' ').trim();
  return line.length <= 200 ? line : `${line.slice(0, 199)}…`;
}

const setLink = (id: number) => `${env().APP_URL.replace(/\/+$/, '')}/library/sets/${id}`;
const setTitle = (dto: LibrarySetDto) => `${dto.material.name} — ${dto.condition}`;

/** The drafter and, when someone else, the last editor: the people whose work was reviewed. */
async function authorsOf(dto: LibrarySetDto): Promise<string[]> {
  const ids = [...new Set([dto.draftedBy?.id, dto.lastEditedBy?.id].filter((v): v is number => typeof v === 'number'))];
  if (!ids.length) return [];
  const users = await User.findAll({ where: { id: ids, active: true }, attributes: ['email'] });
  return users.map((u) => u.email);
}

async function mailInChunks(to: string[], subjectLine: string, text: string): Promise<void> {
  for (let i = 0; i < to.length; i += 50) {
    await sendMailSafely({ to: to.slice(i, i + 50), subject: subject(subjectLine), text });
  }
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
        status: 'draft',
        version: 1,
        lineageId: newId,
        supersedesId: null,
        supersededById: null,
        draftedById: actor.id,
        lastEditedById: actor.id,
        approvedById: null,
        publishedAt: null,
        retiredAt: null,
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
    const ps = await lockSet(transaction, id);
    assertCurrent(ps, lockVersion);
    if (ps.status !== 'draft') throw wrongStatus(`Only drafts can be edited; this set is ${ps.status}.`);
    if (ps.supersedesId && (d.material || d.materialId !== ps.materialId)) {
      throw badRequest('A revision keeps the material of the set it revises.', {
        [d.material ? 'material' : 'materialId']: 'must stay the material of the revised set',
      });
    }
    const before = snapshot(ps);
    const materialId = await resolveMaterial(transaction, d, actor);
    const referenceId = await resolveReference(transaction, d, actor);
    ps.set({ ...valuesOf(d), materialId, referenceId, lastEditedById: actor.id });
    await ps.save({ transaction }); // increments lockVersion (the model's version attribute)
    await recordAudit(transaction, { actorId: actor.id, action: 'edit', entityType: 'property-set', entityId: id, before, after: snapshot(ps) });
  });
  return loadDto(id);
}

/** draft → in review; tells every other active librarian and admin. */
export async function submitSet(id: number, lockVersion: number, actor: Actor): Promise<LibrarySetDto> {
  const dto = await sequelize().transaction(async (transaction) => {
    const ps = await lockSet(transaction, id);
    assertCurrent(ps, lockVersion);
    if (ps.status !== 'draft') throw wrongStatus(`Only drafts can be submitted; this set is ${ps.status}.`);
    const before = snapshot(ps);
    ps.set({ status: 'in-review', submittedAt: new Date() });
    await ps.save({ transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'submit', entityType: 'property-set', entityId: id, before, after: snapshot(ps) });
    return loadDto(id, transaction);
  });
  const reviewers = await User.findAll({
    where: { role: ['librarian', 'admin'], active: true, id: { [Op.ne]: actor.id } },
    attributes: ['email'],
    order: [['id', 'ASC']],
  });
  await mailInChunks(
    reviewers.map((u) => u.email),
    `Property set waiting for review: ${setTitle(dto)}`,
    [
      `${actor.name} submitted a property set for review:`,
      '',
      `  ${setTitle(dto)} (version ${dto.version})`,
      '',
      `Review it on the library desk: ${setLink(id)}`,
      '',
      'Approve it or return it with a comment. The author and the last editor cannot approve their own work.',
    ].join('\n'),
  );
  return dto;
}

function assertNotOwnWork(ps: PropertySet, actor: Actor, what: string): void {
  if (ps.draftedById === actor.id || ps.lastEditedById === actor.id) throw ownWork(what);
}

/**
 * in review → published, by someone who neither drafted nor last edited it. A set it supersedes
 * is retired in the same transaction and points at its successor; it stays readable.
 */
export async function approveSet(id: number, lockVersion: number, actor: Actor): Promise<LibrarySetDto> {
  const dto = await sequelize().transaction(async (transaction) => {
    const ps = await lockSet(transaction, id);
    assertCurrent(ps, lockVersion);
    assertNotOwnWork(ps, actor, 'approve');
    if (ps.status !== 'in-review') throw wrongStatus(`Only sets in review can be approved; this set is ${ps.status}.`);
    if (ps.referenceId == null) {
      throw badRequest('A published set must cite a reference. Return it to the author to add one.', { referenceId: 'is required to publish' });
    }
    const now = new Date();
    if (ps.supersedesId) {
      const old = await lockSet(transaction, ps.supersedesId);
      const oldBefore = snapshot(old);
      // Retire the old version first: a lineage has at most one published version (unique index).
      old.set({ supersededById: ps.id, ...(old.status === 'published' ? { status: 'retired' as const, retiredAt: now } : {}) });
      await old.save({ transaction });
      await recordAudit(transaction, { actorId: actor.id, action: 'supersede', entityType: 'property-set', entityId: old.id, before: oldBefore, after: snapshot(old) });
    }
    const before = snapshot(ps);
    ps.set({ status: 'published', approvedById: actor.id, publishedAt: now, returnedComment: null });
    await ps.save({ transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'approve', entityType: 'property-set', entityId: id, before, after: snapshot(ps) });
    return loadDto(id, transaction);
  });
  // The model hooks fired inside the transaction; drop the snapshot again so a read that ran
  // between those hooks and the commit cannot keep the old catalogue.
  invalidateCatalogueSnapshot();
  await mailInChunks(
    await authorsOf(dto),
    `Property set published: ${setTitle(dto)}`,
    [
      `${actor.name} approved your property set, and it is now in the catalogue:`,
      '',
      `  ${setTitle(dto)} (version ${dto.version})`,
      ...(dto.supersedesId ? ['', `It supersedes set ${dto.supersedesId}, which is now retired.`] : []),
      '',
      setLink(id),
    ].join('\n'),
  );
  return dto;
}

/** in review → draft with the reviewer's comment, which the author receives by e-mail. */
export async function returnSet(id: number, lockVersion: number, comment: string, actor: Actor): Promise<LibrarySetDto> {
  const dto = await sequelize().transaction(async (transaction) => {
    const ps = await lockSet(transaction, id);
    assertCurrent(ps, lockVersion);
    assertNotOwnWork(ps, actor, 'return');
    if (ps.status !== 'in-review') throw wrongStatus(`Only sets in review can be returned; this set is ${ps.status}.`);
    const before = snapshot(ps);
    ps.set({ status: 'draft', returnedComment: comment, submittedAt: null });
    await ps.save({ transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'return', entityType: 'property-set', entityId: id, before, after: { ...snapshot(ps), comment } });
    return loadDto(id, transaction);
  });
  await mailInChunks(
    await authorsOf(dto),
    `Property set returned: ${setTitle(dto)}`,
    [
      `${actor.name} returned your property set to draft:`,
      '',
      `  ${setTitle(dto)} (version ${dto.version})`,
      '',
      'Comment:',
      '',
      comment,
      '',
      `Edit it and submit it again: ${setLink(id)}`,
    ].join('\n'),
  );
  return dto;
}

/** A new draft copying a published set: version + 1, same lineage, supersedes it. */
export async function reviseSet(id: number, lockVersion: number, actor: Actor): Promise<LibrarySetDto> {
  let newId: number;
  try {
    newId = await sequelize().transaction(async (transaction) => {
      const ps = await lockSet(transaction, id);
      assertCurrent(ps, lockVersion);
      if (ps.status !== 'published') throw wrongStatus(`Only published sets can be revised; this set is ${ps.status}.`);
      const lineageId = ps.lineageId ?? ps.id;
      const open = await PropertySet.count({ where: { lineageId, status: ['draft', 'in-review'] }, transaction });
      if (open > 0) throw revisionOpen();
      const latest = (await PropertySet.max<number, PropertySet>('version', { where: { lineageId }, transaction })) ?? ps.version;
      const source = snapshot(ps);
      const copy = await PropertySet.create(
        {
          materialId: ps.materialId,
          referenceId: ps.referenceId,
          condition: ps.condition,
          density: ps.density,
          youngsModulus: ps.youngsModulus,
          poissonsRatio: ps.poissonsRatio,
          tensileStrength: ps.tensileStrength,
          tensileYield: ps.tensileYield,
          compressiveStrength: ps.compressiveStrength,
          compressiveYield: ps.compressiveYield,
          shearStrength: ps.shearStrength,
          shearYield: ps.shearYield,
          elongation: ps.elongation,
          luminousTransmittance: ps.luminousTransmittance,
          serviceTempMin: ps.serviceTempMin,
          serviceTempMax: ps.serviceTempMax,
          valueDetails: ps.valueDetails,
          temperatureFactors: ps.temperatureFactors,
          sustainedLoadFactors: ps.sustainedLoadFactors,
          cyclicFactors: ps.cyclicFactors,
          status: 'draft',
          version: Math.max(latest, ps.version) + 1,
          lineageId,
          supersedesId: ps.id,
          supersededById: null,
          draftedById: actor.id,
          lastEditedById: actor.id,
          approvedById: null,
          publishedAt: null,
          retiredAt: null,
        },
        { transaction },
      );
      await recordAudit(transaction, { actorId: actor.id, action: 'revise', entityType: 'property-set', entityId: copy.id, before: source, after: snapshot(copy) });
      return copy.id;
    });
  } catch (err) {
    // Two revisions started at the same moment: the partial unique index lets only one in.
    if (err instanceof UniqueConstraintError) throw revisionOpen();
    throw err;
  }
  return loadDto(newId);
}

/** published → retired, with the reason in the audit log. Stays readable; never deleted. */
export async function retireSet(id: number, lockVersion: number, reason: string, actor: Actor): Promise<LibrarySetDto> {
  const dto = await sequelize().transaction(async (transaction) => {
    const ps = await lockSet(transaction, id);
    assertCurrent(ps, lockVersion);
    if (ps.status !== 'published') throw wrongStatus(`Only published sets can be retired; this set is ${ps.status}.`);
    const before = snapshot(ps);
    ps.set({ status: 'retired', retiredAt: new Date() });
    await ps.save({ transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'retire', entityType: 'property-set', entityId: id, before, after: { ...snapshot(ps), reason } });
    return loadDto(id, transaction);
  });
  invalidateCatalogueSnapshot();
  return dto;
}

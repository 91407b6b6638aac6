import { Op, type Transaction } from 'sequelize';
import type { z } from 'zod';
import { sequelize } from '../../db/sequelize';
import { Material, PropertySet, Reference, User } from '../../db/models';
import { DesignRecord, LoadCaseRecord, ProjectMember, Shortlist, ShortlistItem } from '../../db/models/projects';
import { can } from '../../../shared/schemas/auth';
import type {
  DesignRecordContent,
  DesignRecordDto,
  ShortlistDto,
  ShortlistItemDto,
  ShortlistSummaryDto,
  DesignRecordSummaryDto,
  shortlistCreateSchema,
  shortlistItemAddSchema,
  shortlistReorderSchema,
} from '../../../shared/schemas/projects';
import type { PropertySetDto } from '../../../shared/schemas/catalogue';
import { CAUTIONS_TEXT } from '../../../shared/cautions';
import { evaluate, type CandidateResult } from '../../../shared/engine';
import { candidateForSet } from '../property-sets/snapshot';
import { AppError, badRequest, conflict, forbidden, notFound } from '../../errors';
import { recordAudit } from '../../services/audit';
import { sendMailSafely } from '../../services/mail';
import { env } from '../../config/env';
import { propertySetDto } from '../property-sets/service';
import { visibleProject, writableProject, type Actor } from './access';
import { loadCaseDto, userSummary } from './service';

const itemInclude = [
  {
    model: PropertySet,
    as: 'propertySet',
    include: [
      { model: Material, as: 'material' },
      { model: Reference, as: 'reference' },
      { model: User, as: 'draftedBy', attributes: ['id', 'name'] },
      { model: User, as: 'approvedBy', attributes: ['id', 'name'] },
    ],
  },
];

async function loadShortlist(id: number, transaction?: Transaction): Promise<Shortlist> {
  const shortlist = await Shortlist.findByPk(id, {
    include: [
      { model: User, as: 'author' },
      { model: User, as: 'checker' },
      { model: LoadCaseRecord, as: 'loadCaseRecord', include: [{ model: User, as: 'createdBy' }] },
      { model: ShortlistItem, as: 'items', include: itemInclude },
    ],
    order: [[{ model: ShortlistItem, as: 'items' }, 'position', 'ASC']],
    transaction,
  });
  if (!shortlist) throw notFound('Shortlist');
  return shortlist;
}

/** The shortlist if the actor can see its project (404 otherwise, like the project). */
async function visibleShortlist(actor: Actor, id: number, transaction?: Transaction): Promise<Shortlist> {
  const shortlist = await loadShortlist(id, transaction);
  await visibleProject(actor, shortlist.projectId, transaction).catch(() => {
    throw notFound('Shortlist');
  });
  return shortlist;
}

/** Newest published version in each set's lineage, where it is not the set itself. */
async function newerVersions(sets: PropertySetDto[], lineages: Map<number, number | null>): Promise<Map<number, number>> {
  const ids = [...new Set([...lineages.values()].filter((v): v is number => v !== null))];
  const out = new Map<number, number>();
  if (!ids.length) return out;
  const published = await PropertySet.findAll({
    where: { lineageId: { [Op.in]: ids }, status: 'published' },
    attributes: ['id', 'lineageId', 'version'],
  });
  for (const set of sets) {
    const lineage = lineages.get(set.id);
    const newest = published.filter((p) => p.lineageId === lineage).sort((a, b) => b.version - a.version)[0];
    if (newest && newest.id !== set.id && newest.version > set.version) out.set(set.id, newest.id);
  }
  return out;
}

/** The shortlist's sets evaluated as Evaluate does: with the published rating tables that cover them. */
async function evaluateItems(shortlist: Shortlist, sets: PropertySetDto[]) {
  if (!sets.length) return null;
  const candidates = await Promise.all(sets.map((set) => candidateForSet(set)));
  return evaluate({ loadCase: shortlist.loadCaseRecord!.loadCase, candidates, limit: sets.length });
}

async function shortlistDto(shortlist: Shortlist): Promise<ShortlistDto> {
  const items = shortlist.items ?? [];
  const sets = items.map((i) => propertySetDto(i.propertySet!));
  const lineages = new Map(items.map((i) => [i.propertySetId, i.propertySet!.lineageId]));
  const [newer, record] = await Promise.all([
    newerVersions(sets, lineages),
    DesignRecord.findOne({ where: { shortlistId: shortlist.id }, attributes: ['id'] }),
  ]);
  const evaluation = await evaluateItems(shortlist, sets);
  const resultFor = (id: number): CandidateResult | null => evaluation?.results.find((r) => r.propertySetId === id) ?? null;
  const itemDtos: ShortlistItemDto[] = items.map((item, i) => ({
    id: item.id,
    position: item.position,
    note: item.note,
    propertySet: sets[i],
    result: resultFor(item.propertySetId),
    newerVersionId: newer.get(item.propertySetId) ?? null,
  }));
  return {
    id: shortlist.id,
    projectId: shortlist.projectId,
    name: shortlist.name,
    status: shortlist.status,
    loadCase: loadCaseDto(shortlist.loadCaseRecord!),
    author: userSummary(shortlist.author!),
    checker: shortlist.checker ? userSummary(shortlist.checker) : null,
    submittedAt: shortlist.submittedAt?.toISOString() ?? null,
    checkedAt: shortlist.checkedAt?.toISOString() ?? null,
    returnedComment: shortlist.returnedComment,
    checkComment: shortlist.checkComment,
    lockVersion: shortlist.lockVersion,
    items: itemDtos,
    evaluation: evaluation ? { pressure: evaluation.pressure, proofTestPressure: evaluation.proofTestPressure, pressureMethod: evaluation.pressureMethod } : null,
    designRecordId: record?.id ?? null,
  };
}

export async function listShortlists(actor: Actor, projectId: number): Promise<ShortlistSummaryDto[]> {
  await visibleProject(actor, projectId);
  const rows = await Shortlist.findAll({
    where: { projectId },
    include: [{ model: User, as: 'author', attributes: ['id', 'name'] }, { model: ShortlistItem, as: 'items', attributes: ['id'] }],
    order: [['updatedAt', 'DESC']],
  });
  const records = await DesignRecord.findAll({ where: { projectId }, attributes: ['id', 'shortlistId'] });
  return rows.map((s) => ({
    id: s.id,
    name: s.name,
    status: s.status,
    loadCaseId: s.loadCaseId,
    author: { id: s.author!.id, name: s.author!.name },
    itemCount: s.items?.length ?? 0,
    designRecordId: records.find((r) => r.shortlistId === s.id)?.id ?? null,
    updatedAt: s.updatedAt.toISOString(),
  }));
}

export async function getShortlist(actor: Actor, id: number): Promise<ShortlistDto> {
  return shortlistDto(await visibleShortlist(actor, id));
}

export async function createShortlist(actor: Actor, projectId: number, input: z.output<typeof shortlistCreateSchema>): Promise<ShortlistDto> {
  const id = await sequelize().transaction(async (transaction) => {
    await writableProject(actor, projectId, transaction);
    const lc = await LoadCaseRecord.findOne({ where: { id: input.loadCaseId, projectId }, transaction });
    if (!lc) throw badRequest('Choose a load case of this project.', { loadCaseId: 'is not a load case of this project' });
    const shortlist = await Shortlist.create({ projectId, loadCaseId: lc.id, name: input.name, authorId: actor.id, checkerId: null, submittedAt: null, checkedAt: null, returnedComment: null, checkComment: null }, { transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'create', entityType: 'shortlist', entityId: String(shortlist.id), before: null, after: input });
    return shortlist.id;
  });
  return getShortlist(actor, id);
}

/**
 * Runs a change to a shortlist's content: only its author, only while open or returned, and a
 * stale lock version (when given) is refused. The shortlist row is locked for the change.
 */
async function editShortlist(actor: Actor, id: number, lockVersion: number | undefined, change: (s: Shortlist, t: Transaction) => Promise<void>): Promise<ShortlistDto> {
  await sequelize().transaction(async (transaction) => {
    const shortlist = await Shortlist.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!shortlist) throw notFound('Shortlist');
    await writableProject(actor, shortlist.projectId, transaction).catch((err: AppError) => {
      throw err.status === 404 ? notFound('Shortlist') : err;
    });
    if (shortlist.authorId !== actor.id) throw forbidden('Only the author edits a shortlist.');
    if (shortlist.status !== 'open' && shortlist.status !== 'returned') {
      throw conflict(`This shortlist is ${shortlist.status}; it can no longer be changed.`, 'wrong_status');
    }
    if (lockVersion !== undefined && lockVersion !== shortlist.lockVersion) {
      throw conflict('Someone changed this shortlist after you opened it. Reload to see the change.', 'stale');
    }
    await change(shortlist, transaction);
    await shortlist.update({ lockVersion: shortlist.lockVersion + 1 }, { transaction });
  });
  return getShortlist(actor, id);
}

export function addItem(actor: Actor, id: number, input: z.output<typeof shortlistItemAddSchema>): Promise<ShortlistDto> {
  return editShortlist(actor, id, undefined, async (shortlist, transaction) => {
    const set = await PropertySet.findByPk(input.propertySetId, { transaction });
    if (!set || set.status !== 'published') {
      throw badRequest('Only published property sets can be shortlisted.', { propertySetId: 'is not a published property set' });
    }
    const exists = await ShortlistItem.findOne({ where: { shortlistId: id, propertySetId: set.id }, transaction });
    if (exists) throw conflict('This property set is already on the shortlist.', 'duplicate');
    const position = ((await ShortlistItem.max('position', { where: { shortlistId: id }, transaction })) as number | null) ?? 0;
    await ShortlistItem.create({ shortlistId: id, propertySetId: set.id, position: position + 1, note: input.note }, { transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'add-item', entityType: 'shortlist', entityId: String(shortlist.id), before: null, after: input });
  });
}

export function updateItem(actor: Actor, id: number, itemId: number, note: string): Promise<ShortlistDto> {
  return editShortlist(actor, id, undefined, async (shortlist, transaction) => {
    const item = await ShortlistItem.findOne({ where: { id: itemId, shortlistId: id }, transaction });
    if (!item) throw notFound('Shortlist item');
    const before = { note: item.note };
    await item.update({ note }, { transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'edit-item', entityType: 'shortlist', entityId: String(shortlist.id), before, after: { itemId, note } });
  });
}

export function removeItem(actor: Actor, id: number, itemId: number): Promise<ShortlistDto> {
  return editShortlist(actor, id, undefined, async (shortlist, transaction) => {
    const item = await ShortlistItem.findOne({ where: { id: itemId, shortlistId: id }, transaction });
    if (!item) throw notFound('Shortlist item');
    await item.destroy({ transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'remove-item', entityType: 'shortlist', entityId: String(shortlist.id), before: { propertySetId: item.propertySetId, note: item.note }, after: null });
  });
}

export function reorderItems(actor: Actor, id: number, input: z.output<typeof shortlistReorderSchema>): Promise<ShortlistDto> {
  return editShortlist(actor, id, input.lockVersion, async (shortlist, transaction) => {
    const items = await ShortlistItem.findAll({ where: { shortlistId: id }, transaction });
    const known = new Set(items.map((i) => i.id));
    if (input.itemIds.length !== items.length || new Set(input.itemIds).size !== items.length || !input.itemIds.every((i) => known.has(i))) {
      throw badRequest('List every item of the shortlist exactly once.', { itemIds: 'must list every item exactly once' });
    }
    for (const [index, itemId] of input.itemIds.entries()) {
      await ShortlistItem.update({ position: index + 1 }, { where: { id: itemId }, transaction });
    }
    await recordAudit(transaction, { actorId: actor.id, action: 'reorder', entityType: 'shortlist', entityId: String(shortlist.id), before: items.map((i) => i.id), after: input.itemIds });
  });
}

const link = (path: string) => `${env().APP_URL.replace(/\/$/, '')}${path}`;

/** Checkers of the project: members whose role may check, except the author. */
async function projectCheckers(projectId: number, authorId: number): Promise<User[]> {
  const members = await ProjectMember.findAll({ where: { projectId } });
  const users = await User.findAll({ where: { id: members.map((m) => m.userId), active: true } });
  return users.filter((u) => u.id !== authorId && can(u.role, 'shortlist:check'));
}

export async function submitShortlist(actor: Actor, id: number, lockVersion: number): Promise<ShortlistDto> {
  const dto = await editShortlist(actor, id, lockVersion, async (shortlist, transaction) => {
    const count = await ShortlistItem.count({ where: { shortlistId: id }, transaction });
    if (!count) throw badRequest('Add at least one candidate before submitting.', { items: 'add at least one candidate' });
    const before = { status: shortlist.status };
    await shortlist.update({ status: 'submitted', submittedAt: new Date(), returnedComment: null }, { transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'submit', entityType: 'shortlist', entityId: String(id), before, after: { status: 'submitted' } });
  });
  const checkers = await projectCheckers(dto.projectId, dto.author.id);
  if (checkers.length) {
    await sendMailSafely({
      to: checkers.map((c) => c.email),
      subject: `Shortlist to check: ${dto.name}`.slice(0, 200),
      text: `${dto.author.name} submitted the shortlist "${dto.name}" (${dto.items.length} candidate(s), load case "${dto.loadCase.name}") for checking.\n\nOpen it: ${link(`/shortlists/${id}`)}\n\n— Isobath`,
    });
  }
  return dto;
}

/** Locks a submitted shortlist for the checker's decision; refuses authors and non-members. */
async function forDecision(actor: Actor, id: number, lockVersion: number, transaction: Transaction): Promise<Shortlist> {
  const shortlist = await Shortlist.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
  if (!shortlist) throw notFound('Shortlist');
  await visibleProject(actor, shortlist.projectId, transaction).catch(() => {
    throw notFound('Shortlist');
  });
  if (!can(actor.role, 'shortlist:check')) throw forbidden('Only checkers can check shortlists.');
  if (actor.role !== 'admin' && !(await ProjectMember.findOne({ where: { projectId: shortlist.projectId, userId: actor.id }, transaction }))) {
    throw forbidden('Only a checker who is a member of the project can check its shortlists.');
  }
  if (shortlist.authorId === actor.id) throw new AppError(403, 'own_work', 'A shortlist is checked by a second engineer, never by its author.');
  if (shortlist.status !== 'submitted') throw conflict(`This shortlist is ${shortlist.status}, not waiting for a check.`, 'wrong_status');
  if (shortlist.lockVersion !== lockVersion) throw conflict('The shortlist changed after you opened it. Reload to see the change.', 'stale');
  return shortlist;
}

/** Everything needed to read and defend the record later, frozen as it was when checked. */
function freezeContent(dto: ShortlistDto, projectName: string, checker: User, checkedAt: Date, comment: string | null): DesignRecordContent {
  const results = dto.items.map((i) => i.result!);
  return {
    format: 'isobath-design-record',
    formatVersion: 1,
    project: { id: dto.projectId, name: projectName },
    shortlist: { id: dto.id, name: dto.name, submittedAt: dto.submittedAt!, checkedAt: checkedAt.toISOString(), checkComment: comment },
    author: dto.author,
    checker: userSummary(checker),
    loadCase: { name: dto.loadCase.name, input: dto.loadCase.loadCase, notes: dto.loadCase.notes },
    pressure: dto.evaluation!.pressure,
    proofTestPressure: dto.evaluation!.proofTestPressure,
    pressureMethod: dto.evaluation!.pressureMethod,
    candidates: dto.items.map((i) => ({ position: i.position, note: i.note, propertySet: i.propertySet, result: i.result! })),
    cautions: CAUTIONS_TEXT,
    engine: { models: [...new Set(results.flatMap((r) => r.modes.map((m) => m.model)))] },
    frozenAt: checkedAt.toISOString(),
  };
}

export async function checkShortlist(actor: Actor, id: number, lockVersion: number, comment: string | undefined): Promise<ShortlistDto> {
  const before = await getShortlist(actor, id);
  await sequelize().transaction(async (transaction) => {
    const shortlist = await forDecision(actor, id, lockVersion, transaction);
    const checker = (await User.findByPk(actor.id, { transaction }))!;
    const project = await visibleProject(actor, shortlist.projectId, transaction);
    const checkedAt = new Date();
    await shortlist.update({ status: 'checked', checkerId: actor.id, checkedAt, checkComment: comment ?? null, lockVersion: shortlist.lockVersion + 1 }, { transaction });
    const content = freezeContent({ ...before, submittedAt: before.submittedAt ?? shortlist.submittedAt?.toISOString() ?? null }, project.name, checker, checkedAt, comment ?? null);
    const record = await DesignRecord.create({ shortlistId: id, projectId: shortlist.projectId, content }, { transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'check', entityType: 'shortlist', entityId: String(id), before: { status: 'submitted' }, after: { status: 'checked', designRecordId: record.id, comment } });
  });
  const dto = await getShortlist(actor, id);
  const author = await User.findByPk(dto.author.id);
  if (author?.active) {
    await sendMailSafely({
      to: author.email,
      subject: `Shortlist checked: ${dto.name}`.slice(0, 200),
      text: `${dto.checker!.name} checked your shortlist "${dto.name}". Its design record is frozen.\n${comment ? `\nComment: ${comment}\n` : ''}\nDesign record: ${link(`/records/${dto.designRecordId}`)}\n\n— Isobath`,
    });
  }
  return dto;
}

export async function returnShortlist(actor: Actor, id: number, lockVersion: number, comment: string): Promise<ShortlistDto> {
  await sequelize().transaction(async (transaction) => {
    const shortlist = await forDecision(actor, id, lockVersion, transaction);
    await shortlist.update({ status: 'returned', checkerId: actor.id, returnedComment: comment, lockVersion: shortlist.lockVersion + 1 }, { transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'return', entityType: 'shortlist', entityId: String(id), before: { status: 'submitted' }, after: { status: 'returned', comment } });
  });
  const dto = await getShortlist(actor, id);
  const author = await User.findByPk(dto.author.id);
  if (author?.active) {
    await sendMailSafely({
      to: author.email,
      subject: `Shortlist returned: ${dto.name}`.slice(0, 200),
      text: `${dto.checker?.name ?? 'A checker'} returned your shortlist "${dto.name}" with this comment:\n\n${comment}\n\nOpen it: ${link(`/shortlists/${id}`)}\n\n— Isobath`,
    });
  }
  return dto;
}

// ---- Design records ------------------------------------------------------------------------

export async function getDesignRecord(actor: Actor, recordId: number): Promise<DesignRecordDto> {
  const record = await DesignRecord.findByPk(recordId);
  if (!record) throw notFound('Design record');
  await visibleProject(actor, record.projectId).catch(() => {
    throw notFound('Design record');
  });
  const sets = record.content.candidates.map((c) => c.propertySet);
  const rows = await PropertySet.findAll({ where: { id: sets.map((s) => s.id) }, attributes: ['id', 'lineageId'] });
  const newer = await newerVersions(sets, new Map(rows.map((r) => [r.id, r.lineageId])));
  return {
    id: record.id,
    shortlistId: record.shortlistId,
    projectId: record.projectId,
    content: record.content,
    newerData: record.content.candidates
      .filter((c) => newer.has(c.propertySet.id))
      .map((c) => ({ propertySetId: c.propertySet.id, newerVersionId: newer.get(c.propertySet.id)!, name: c.result.name })),
    createdAt: record.createdAt.toISOString(),
  };
}

export async function listDesignRecords(actor: Actor, projectId: number): Promise<DesignRecordSummaryDto[]> {
  await visibleProject(actor, projectId);
  const rows = await DesignRecord.findAll({ where: { projectId }, order: [['createdAt', 'DESC']] });
  return rows.map((r) => ({
    id: r.id,
    shortlistId: r.shortlistId,
    name: r.content.shortlist.name,
    loadCase: r.content.loadCase.name,
    author: r.content.author.name,
    checker: r.content.checker.name,
    checkedAt: r.content.shortlist.checkedAt,
  }));
}

import { Op, type Transaction } from 'sequelize';
import type { z } from 'zod';
import { sequelize } from '../../db/sequelize';
import { Material, PropertySet, Reference, User } from '../../db/models';
import { DesignRecord, LoadCaseRecord, Project, Shortlist, ShortlistItem } from '../../db/models/projects';
import type {
  AwaitingCheckDto,
  ShortlistDto,
  ShortlistItemDto,
  ShortlistSubmission,
  ShortlistSummaryDto,
  shortlistCreateSchema,
  shortlistItemAddSchema,
  shortlistItemUpdateSchema,
  shortlistReorderSchema,
} from '../../../shared/schemas/projects';
import type { PropertySetDto } from '../../../shared/schemas/catalogue';
import { evaluate, type CandidateResult } from '../../../shared/engine';
import { candidateForSet } from '../property-sets/snapshot';
import { AppError, badRequest, conflict, forbidden, notFound } from '../../errors';
import { assertCurrent, lockCurrent, touch } from '../../services/optimistic-lock';
import { recordAudit } from '../../services/audit';
import { citedVersionInclude, propertySetDto } from '../property-sets/service';
import { isAdmin, visibleProject, writableProject, type Actor } from './access';
import { loadCaseDto, userSummary } from './service';

const itemInclude = [
  {
    model: PropertySet,
    as: 'propertySet',
    include: [
      { model: Material, as: 'material' },
      { model: Reference, as: 'reference' },
      citedVersionInclude(),
      { model: User, as: 'draftedBy', attributes: ['id', 'name'] },
      { model: User, as: 'approvedBy', attributes: ['id', 'name'] },
    ],
  },
];

export async function loadShortlist(id: number, transaction?: Transaction): Promise<Shortlist> {
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
export async function newerVersions(sets: PropertySetDto[], lineages: Map<number, number | null>): Promise<Map<number, number>> {
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

/** The items, load case and evaluation as evaluated now, against today's catalogue. */
async function liveInputs(shortlist: Shortlist): Promise<Omit<ShortlistSubmission, 'round' | 'submittedAt'>> {
  const items = shortlist.items ?? [];
  const sets = items.map((i) => propertySetDto(i.propertySet!));
  const evaluation = await evaluateItems(shortlist, sets);
  const resultFor = (id: number): CandidateResult | null => evaluation?.results.find((r) => r.propertySetId === id) ?? null;
  return {
    loadCase: loadCaseDto(shortlist.loadCaseRecord!),
    evaluation: evaluation ? { pressure: evaluation.pressure, proofTestPressure: evaluation.proofTestPressure, pressureMethod: evaluation.pressureMethod } : null,
    items: items.map((item, i) => ({ id: item.id, position: item.position, note: item.note, lockVersion: item.lockVersion, propertySet: sets[i], result: resultFor(item.propertySetId) })),
  };
}

/** What a submission freezes: the shortlist's inputs and results as they are at this moment. */
export async function submissionOf(shortlist: Shortlist, round: number, now: Date): Promise<ShortlistSubmission> {
  return { round, submittedAt: now.toISOString(), ...(await liveInputs(shortlist)) };
}

/**
 * The shortlist as its reader sees it. While it is submitted or checked, the load case, the items
 * and their results are those it was submitted with: what the checker reviews is what is signed.
 */
export async function shortlistDto(shortlist: Shortlist): Promise<ShortlistDto> {
  const frozen = shortlist.submission && (shortlist.status === 'submitted' || shortlist.status === 'checked') ? shortlist.submission : null;
  const inputs = frozen ?? (await liveInputs(shortlist));
  const sets = inputs.items.map((i) => i.propertySet);
  const [newer, record] = await Promise.all([
    newerVersions(sets, new Map(sets.map((s) => [s.id, s.lineageId ?? null]))),
    DesignRecord.findOne({ where: { shortlistId: shortlist.id }, attributes: ['id'] }),
  ]);
  const itemDtos: ShortlistItemDto[] = inputs.items.map((item) => ({ ...item, lockVersion: item.lockVersion ?? 0, newerVersionId: newer.get(item.propertySet.id) ?? null }));
  return {
    id: shortlist.id,
    projectId: shortlist.projectId,
    name: shortlist.name,
    status: shortlist.status,
    loadCase: inputs.loadCase,
    author: userSummary(shortlist.author!),
    checker: shortlist.checker ? userSummary(shortlist.checker) : null,
    submittedAt: shortlist.submittedAt?.toISOString() ?? null,
    checkedAt: shortlist.checkedAt?.toISOString() ?? null,
    returnedComment: shortlist.returnedComment,
    checkComment: shortlist.checkComment,
    lockVersion: shortlist.lockVersion,
    items: itemDtos,
    evaluation: inputs.evaluation,
    frozenInputs: frozen !== null,
    rounds: shortlist.rounds ?? [],
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

/**
 * Shortlists submitted by someone else in the caller's projects (every project for an admin),
 * oldest first: what waits for the caller's check. Nobody checks their own (decision 8).
 */
export async function awaitingCheck(actor: Actor): Promise<AwaitingCheckDto[]> {
  const rows = await Shortlist.findAll({
    where: {
      status: 'submitted',
      authorId: { [Op.ne]: actor.id },
      ...(isAdmin(actor) ? {} : { projectId: { [Op.in]: sequelize().literal(`(SELECT project_id FROM project_members WHERE user_id = ${Number(actor.id)})`) } }),
    },
    include: [{ model: User, as: 'author', attributes: ['id', 'name'] }],
    order: [['submittedAt', 'ASC']],
  });
  const projects = await Project.findAll({ where: { id: { [Op.in]: [...new Set(rows.map((r) => r.projectId))] } }, attributes: ['id', 'name'] });
  return rows.map((s) => {
    const items = s.submission?.items ?? [];
    return {
      id: s.id,
      name: s.name,
      project: { id: s.projectId, name: projects.find((p) => p.id === s.projectId)?.name ?? '' },
      author: { id: s.author!.id, name: s.author!.name },
      submittedAt: (s.submittedAt ?? s.updatedAt).toISOString(),
      itemCount: items.length,
      belowTarget: items.filter((i) => i.result !== null && i.result.margin < 0).map((i) => i.result!.name),
    };
  });
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
 * stale lock version (when given) is refused. The shortlist row is locked for the change, and
 * its lock version moves on with every change to its items.
 */
async function editShortlist(actor: Actor, id: number, lockVersion: number | undefined, change: (s: Shortlist, t: Transaction) => Promise<void>): Promise<ShortlistDto> {
  await sequelize().transaction(async (transaction) => {
    const shortlist = await lockCurrent(Shortlist, transaction, id, null, 'Shortlist');
    await writableProject(actor, shortlist.projectId, transaction).catch((err: AppError) => {
      throw err.status === 404 ? notFound('Shortlist') : err;
    });
    if (shortlist.authorId !== actor.id) throw forbidden('Only the author edits a shortlist.');
    if (shortlist.status !== 'open' && shortlist.status !== 'returned') {
      throw conflict(`This shortlist is ${shortlist.status}; it can no longer be changed.`, 'wrong_status');
    }
    assertCurrent(shortlist, lockVersion, 'shortlist');
    await change(shortlist, transaction);
    await touch(shortlist, transaction);
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

export function updateItem(actor: Actor, id: number, itemId: number, input: z.output<typeof shortlistItemUpdateSchema>): Promise<ShortlistDto> {
  const { note, lockVersion } = input;
  return editShortlist(actor, id, undefined, async (shortlist, transaction) => {
    const item = await ShortlistItem.findOne({ where: { id: itemId, shortlistId: id }, transaction, lock: transaction.LOCK.UPDATE });
    if (!item) throw notFound('Shortlist item');
    assertCurrent(item, lockVersion, 'note');
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

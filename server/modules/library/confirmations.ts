// Confirming a value of a published set, as a reviewed step (shared/workflows/confirmation.ts):
// a librarian proposes where the source shows it; a different person approves, which marks the
// value confirmed on the set (who proposed, who approved, when), or rejects it with a comment.
// The set's values never change here: only what is known about them.
import { Op, UniqueConstraintError, type Transaction } from 'sequelize';
import { PropertySet, Reference, User, ValueConfirmation, Material } from '../../db/models';
import { sequelize } from '../../db/sequelize';
import { badRequest, conflict, notFound } from '../../errors';
import { recordAudit } from '../../services/audit';
import { appLink } from '../../services/app-link';
import { auditSnapshot, lockCurrent } from '../../services/optimistic-lock';
import { mailInChunks, runStep, type Actor, type WorkflowKind } from '../../workflows/run-step';
import { CONFIRMATION_STEPS, type ConfirmationStatus, type ConfirmationStepName } from '../../../shared/workflows/confirmation';
import { PROVENANCE_LABELS, presentKeys, type ConfirmationProposal, type ConfirmationStepInput, type ValueConfirmationDto } from '../../../shared/schemas/provenance';
import { invalidateCatalogueSnapshot } from '../property-sets/snapshot';

const include = () => [
  { model: PropertySet, as: 'propertySet', attributes: ['id', 'condition', 'materialId'], include: [{ model: Material, as: 'material', attributes: ['name'] }] },
  { model: User, as: 'proposedBy', attributes: ['id', 'name'] },
  { model: User, as: 'decidedBy', attributes: ['id', 'name'] },
];

function dto(c: ValueConfirmation): ValueConfirmationDto {
  const set = c.propertySet!;
  return {
    id: c.id,
    propertySetId: c.propertySetId,
    setTitle: `${set.material?.name ?? 'Material'} — ${set.condition}`,
    key: c.valueKey,
    location: c.location,
    source: c.source,
    documentPage: c.documentPage,
    status: c.status,
    proposedBy: { id: c.proposedBy!.id, name: c.proposedBy!.name },
    decidedBy: c.decidedBy ? { id: c.decidedBy.id, name: c.decidedBy.name } : null,
    decidedAt: c.decidedAt?.toISOString() ?? null,
    comment: c.comment,
    lockVersion: c.lockVersion,
    createdAt: c.createdAt.toISOString(),
  };
}

async function load(id: number): Promise<ValueConfirmationDto> {
  const c = await ValueConfirmation.findByPk(id, { include: include() });
  if (!c) throw notFound('Value confirmation');
  return dto(c);
}

export async function listConfirmations(query: { status?: ConfirmationStatus; propertySetId?: number }): Promise<ValueConfirmationDto[]> {
  const rows = await ValueConfirmation.findAll({
    where: { ...(query.status ? { status: query.status } : {}), ...(query.propertySetId ? { propertySetId: query.propertySetId } : {}) },
    include: include(),
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    limit: 500,
  });
  return rows.map(dto);
}

/** Proposes that one value of a published set stands in the source at the given location. */
export async function proposeConfirmation(setId: number, input: ConfirmationProposal, actor: Actor): Promise<ValueConfirmationDto> {
  let id: number;
  try {
    id = await sequelize().transaction(async (transaction) => {
      const set = await PropertySet.findByPk(setId, { transaction });
      if (!set) throw notFound('Property set');
      if (set.status !== 'published') throw conflict('Values are confirmed here only on published sets; a draft carries its claims in the editor.', 'wrong_status');
      if (!presentKeys(set as never).includes(input.key)) throw badRequest('This set has no such value.', { key: 'is not a value of this set' });
      if (input.documentPage !== undefined) {
        const ref = set.referenceId ? await Reference.findByPk(set.referenceId, { attributes: ['documentKey'], transaction }) : null;
        if (!ref?.documentKey) throw badRequest('The set’s reference has no stored document to point a page at.', { documentPage: 'needs a stored document on the reference' });
      }
      const row = await ValueConfirmation.create(
        { propertySetId: set.id, valueKey: input.key, location: input.location, source: input.source ?? null, documentPage: input.documentPage ?? null, proposedById: actor.id },
        { transaction },
      );
      await recordAudit(transaction, { actorId: actor.id, action: 'propose', entityType: 'value-confirmation', entityId: row.id, before: null, after: auditSnapshot(row) });
      return row.id;
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw conflict('A confirmation of this value is already waiting for review.', 'duplicate');
    throw err;
  }
  const made = await load(id);
  const reviewers = await User.findAll({ where: { role: ['librarian', 'admin'], active: true, id: { [Op.ne]: actor.id } }, attributes: ['email'], order: [['id', 'ASC']] });
  await mailInChunks(
    reviewers.map((u) => u.email),
    `Value confirmation to review: ${PROVENANCE_LABELS[made.key]} of ${made.setTitle}`,
    [`${actor.name} proposes that ${PROVENANCE_LABELS[made.key].toLowerCase()} of`, '', `  ${made.setTitle}`, '', `stands in its source at: ${made.location}`, '', `Review it on the library desk: ${appLink(`/library/sets/${made.propertySetId}`)}`].join('\n'),
  );
  return made;
}

const confirmationKind: WorkflowKind<ConfirmationStatus, ConfirmationStepName, ValueConfirmation> = {
  steps: CONFIRMATION_STEPS,
  model: ValueConfirmation,
  entityType: 'value-confirmation',
  noun: 'value confirmation',
  subject: async (row) => ({ status: row.status, authorIds: [row.proposedById] }),
  async apply(row, step, { actor, comment, now, transaction }) {
    row.set({ status: step.name === 'approve' ? 'approved' : 'rejected', decidedById: actor.id, decidedAt: now, comment: comment ?? null });
    if (step.name !== 'approve') return;
    const set = await lockCurrent(PropertySet, transaction, row.propertySetId, null, 'Property set');
    if (set.status !== 'published') throw conflict('The set is no longer published; confirm the value on its current version.', 'wrong_status');
    const proposer = (await User.findByPk(row.proposedById, { attributes: ['id', 'name'], transaction }))!;
    const before = auditSnapshot(set);
    set.set({
      provenance: {
        ...set.provenance,
        [row.valueKey]: {
          status: 'confirmed',
          location: row.documentPage ? `${row.location} (stored document, page ${row.documentPage})` : row.location,
          ...(row.source ? { source: row.source } : {}),
          confirmedBy: { id: proposer.id, name: proposer.name },
          confirmedAt: now.toISOString(),
          approvedBy: { id: actor.id, name: actor.name },
        },
      },
    });
    await set.save({ transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'confirm-value', entityType: 'property-set', entityId: set.id, before, after: { ...auditSnapshot(set), confirmationId: row.id } });
  },
  afterCommit: () => invalidateCatalogueSnapshot(),
  async notify(id, step, actor, comment) {
    const c = await load(id);
    const proposer = await User.findByPk(c.proposedBy.id, { attributes: ['email', 'active'] });
    if (!proposer?.active) return;
    const what = `${PROVENANCE_LABELS[c.key]} of ${c.setTitle}`;
    await mailInChunks(
      [proposer.email],
      `Value confirmation ${step.name === 'approve' ? 'approved' : 'rejected'}: ${what}`,
      step.name === 'approve'
        ? `${actor.name} approved your confirmation: ${what} now reads as confirmed at ${c.location}.\n\n${appLink(`/library/sets/${c.propertySetId}`)}`
        : `${actor.name} rejected your confirmation of ${what}:\n\n${comment ?? ''}\n\n${appLink(`/library/sets/${c.propertySetId}`)}`,
    );
  },
};

export async function stepConfirmation(id: number, input: ConfirmationStepInput, actor: Actor): Promise<ValueConfirmationDto> {
  await runStep(confirmationKind, id, input.step, { lockVersion: input.lockVersion, comment: 'comment' in input ? input.comment : undefined }, actor);
  return load(id);
}

/**
 * When a published set leaves the catalogue (retired, or superseded by a new version), the
 * confirmations still waiting on it can no longer be decided (approval needs a published set):
 * they are closed as rejected with the reason, in the same transaction, each audited. A value that
 * still stands in the source is proposed again on the current version.
 */
export async function closeOpenConfirmations(propertySetId: number, reason: string, actor: Actor, transaction: Transaction): Promise<void> {
  const open = await ValueConfirmation.findAll({ where: { propertySetId, status: 'proposed' }, order: [['id', 'ASC']], lock: transaction.LOCK.UPDATE, transaction });
  const now = new Date();
  for (const c of open) {
    const before = auditSnapshot(c);
    c.set({ status: 'rejected', decidedById: actor.id, decidedAt: now, comment: `Closed without a decision: ${reason}. Propose it again on the current version if the value still stands in the source.` });
    await c.save({ transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'close', entityType: 'value-confirmation', entityId: c.id, before, after: auditSnapshot(c) });
  }
}

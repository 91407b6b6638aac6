// A shortlist's sign-off, run from its table (shared/workflows/shortlist.ts) by the shared step
// runner: its author submits it; a second engineer who may check and belongs to the project
// checks it, which freezes a design record in the same transaction, or returns it with a comment.
import type { Transaction } from 'sequelize';
import { Project, ProjectMember, DesignRecord, Shortlist, ShortlistItem } from '../../db/models/projects';
import { User } from '../../db/models';
import { can } from '../../../shared/roles';
import type { DesignRecordContent, ShortlistDto, ShortlistRoundDto, ShortlistStatus, ShortlistSubmission } from '../../../shared/schemas/projects';
import { CAUTIONS_TEXT } from '../../../shared/cautions';
import { SHORTLIST_STEPS, type ShortlistStepName } from '../../../shared/workflows/shortlist';
import { notFound } from '../../errors';
import { queueMail } from '../../services/outbox';
import { appLink } from '../../services/app-link';
import { runStep, subjectLine, type Actor, type WorkflowKind } from '../../workflows/run-step';
import { visibleProject } from './access';
import { getShortlist, loadShortlist, shortlistDto, submissionOf } from './shortlists';
import { userSummary } from './service';

/** Everything needed to read and defend the record later: what was submitted, as it was checked. */
function freezeContent(dto: ShortlistDto, projectName: string, checker: User, checkedAt: Date, comment: string | null, rounds: ShortlistRoundDto[]): DesignRecordContent {
  const results = dto.items.map((i) => i.result!);
  return {
    format: 'isobath-design-record',
    formatVersion: 2,
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
    rounds,
  };
}

const leaves = (value: unknown, prefix = ''): [string, unknown][] =>
  value && typeof value === 'object' && !Array.isArray(value)
    ? Object.entries(value as Record<string, unknown>).flatMap(([k, v]) => leaves(v, prefix ? `${prefix}.${k}` : k))
    : [[prefix, value]];
const shown = (v: unknown) => (typeof v === 'number' ? String(Number(v.toPrecision(6))) : v === undefined ? '—' : JSON.stringify(v));

/** What a round changes against the round before, in words. */
export function roundChanges(previous: ShortlistRoundDto | undefined, next: Pick<ShortlistRoundDto, 'loadCase' | 'candidates'>): string[] {
  if (!previous) return [];
  const out: string[] = [];
  if (previous.loadCase.name !== next.loadCase.name) out.push(`Load case renamed “${previous.loadCase.name}” → “${next.loadCase.name}”.`);
  const before = new Map(leaves(previous.loadCase.input));
  const after = new Map(leaves(next.loadCase.input));
  for (const key of [...new Set([...before.keys(), ...after.keys()])].sort()) {
    if (JSON.stringify(before.get(key)) !== JSON.stringify(after.get(key))) out.push(`Load case ${key}: ${shown(before.get(key))} → ${shown(after.get(key))}.`);
  }
  const was = new Map(previous.candidates.map((c) => [c.propertySetId, c]));
  const now = new Map(next.candidates.map((c) => [c.propertySetId, c]));
  for (const c of next.candidates) {
    const old = was.get(c.propertySetId);
    if (!old) out.push(`Added ${c.name} (version ${c.version}).`);
    else if (old.note !== c.note) out.push(`Note on ${c.name} changed.`);
  }
  for (const c of previous.candidates) if (!now.has(c.propertySetId)) out.push(`Removed ${c.name} (version ${c.version}).`);
  if (!out.length && previous.candidates.map((c) => c.propertySetId).join() !== next.candidates.map((c) => c.propertySetId).join()) out.push('Candidates reordered.');
  return out.length ? out : ['Nothing changed.'];
}

/** The round a submission opens, with what changed since the last one. */
function openRound(rounds: ShortlistRoundDto[], submission: ShortlistSubmission, actor: Actor): ShortlistRoundDto {
  const lc = submission.loadCase;
  const base = {
    loadCase: { id: lc.id, name: lc.name, input: lc.loadCase },
    candidates: submission.items.map((i) => ({ propertySetId: i.propertySet.id, name: `${i.propertySet.material.name} — ${i.propertySet.condition}`, version: i.propertySet.version, note: i.note })),
  };
  return {
    round: submission.round,
    submittedAt: submission.submittedAt,
    submittedBy: { id: actor.id, name: actor.name },
    ...base,
    changes: roundChanges(rounds.at(-1), base),
    outcome: null,
    decidedAt: null,
    decidedBy: null,
    comment: null,
  };
}

/** The rounds with the open one closed by a decision. */
function closeRound(rounds: ShortlistRoundDto[], outcome: 'returned' | 'checked', actor: Actor, now: Date, comment: string | undefined): ShortlistRoundDto[] {
  return rounds.map((r, i) => (i === rounds.length - 1 ? { ...r, outcome, decidedAt: now.toISOString(), decidedBy: { id: actor.id, name: actor.name }, comment: comment ?? null } : r));
}

/** Checkers of the project: active members whose role may check, except the author. */
async function projectCheckers(projectId: number, authorId: number): Promise<User[]> {
  const members = await ProjectMember.findAll({ where: { projectId } });
  const users = await User.findAll({ where: { id: members.map((m) => m.userId), active: true } });
  return users.filter((u) => u.id !== authorId && can(u.role, 'shortlist:check'));
}

/**
 * Freezes the design record of a shortlist being checked, from what was submitted (the row is
 * locked by the runner, and its status already says checked, so the DTO reads the submission).
 */
async function freezeRecord(shortlist: Shortlist, actor: Actor, comment: string | undefined, now: Date, transaction: Transaction): Promise<number> {
  const loaded = await loadShortlist(shortlist.id, transaction);
  loaded.set({ status: 'checked', submission: shortlist.submission });
  const dto = await shortlistDto(loaded);
  const checker = (await User.findByPk(actor.id, { transaction }))!;
  const project = (await Project.findByPk(shortlist.projectId, { transaction }))!;
  const content = freezeContent(dto, project.name, checker, now, comment ?? null, shortlist.rounds);
  const record = await DesignRecord.create({ shortlistId: shortlist.id, projectId: shortlist.projectId, content }, { transaction });
  return record.id;
}

const shortlistKind: WorkflowKind<ShortlistStatus, ShortlistStepName, Shortlist> = {
  steps: SHORTLIST_STEPS,
  model: Shortlist,
  entityType: 'shortlist',
  noun: 'shortlist',
  async admit(row, actor, transaction) {
    await visibleProject(actor, row.projectId, transaction).catch(() => {
      throw notFound('Shortlist');
    });
  },
  async subject(row, transaction) {
    const [members, items] = await Promise.all([
      ProjectMember.findAll({ where: { projectId: row.projectId }, attributes: ['userId'], transaction }),
      ShortlistItem.count({ where: { shortlistId: row.id }, transaction }),
    ]);
    return { status: row.status, authorIds: [row.authorId], memberIds: members.map((m) => m.userId), facts: { hasItems: items > 0 } };
  },
  async apply(row, step, { actor, comment, now, transaction }) {
    switch (step.name) {
      case 'submit': {
        // Freeze the inputs now: the checker reviews them, and the record is made from them.
        const rounds = row.rounds ?? [];
        const submission = await submissionOf(await loadShortlist(row.id, transaction), rounds.length + 1, now);
        row.set({ status: 'submitted', submittedAt: now, returnedComment: null, submission, rounds: [...rounds, openRound(rounds, submission, actor)] });
        return;
      }
      case 'return':
        row.set({ status: 'returned', checkerId: actor.id, returnedComment: comment ?? null, submission: null, rounds: closeRound(row.rounds, 'returned', actor, now, comment) });
        return;
      case 'check':
        row.set({ status: 'checked', checkerId: actor.id, checkedAt: now, checkComment: comment ?? null, rounds: closeRound(row.rounds, 'checked', actor, now, comment) });
        return { auditExtra: { designRecordId: await freezeRecord(row, actor, comment, now, transaction) } };
    }
  },
  async notify(id, step, actor, comment) {
    const shortlist = await loadShortlist(id);
    const author = shortlist.author!;
    if (step.name === 'submit') {
      const checkers = await projectCheckers(shortlist.projectId, author.id);
      if (!checkers.length) return;
      await queueMail({
        to: checkers.map((c) => c.email),
        subject: subjectLine(`Shortlist to check: ${shortlist.name}`),
        text: `${author.name} submitted the shortlist "${shortlist.name}" (${shortlist.items?.length ?? 0} candidate(s), load case "${shortlist.loadCaseRecord!.name}") for checking.\n\nOpen it: ${appLink(`/shortlists/${id}`)}\n\n— Isobath`,
      });
      return;
    }
    if (!author.active) return;
    const checker = shortlist.checker?.name ?? actor.name;
    if (step.name === 'check') {
      const record = await DesignRecord.findOne({ where: { shortlistId: id }, attributes: ['id'] });
      await queueMail({
        to: author.email,
        subject: subjectLine(`Shortlist checked: ${shortlist.name}`),
        text: `${checker} checked your shortlist "${shortlist.name}". Its design record is frozen.\n${comment ? `\nComment: ${comment}\n` : ''}\nDesign record: ${appLink(`/records/${record?.id}`)}\n\n— Isobath`,
      });
      return;
    }
    await queueMail({
      to: author.email,
      subject: subjectLine(`Shortlist returned: ${shortlist.name}`),
      text: `${checker} returned your shortlist "${shortlist.name}" with this comment:\n\n${comment ?? ''}\n\nOpen it: ${appLink(`/shortlists/${id}`)}\n\n— Isobath`,
    });
  },
};

/** Submits, checks or returns a shortlist; answers the shortlist as the caller now sees it. */
export async function stepShortlist(actor: Actor, id: number, step: ShortlistStepName, input: { lockVersion: number; comment?: string }): Promise<ShortlistDto> {
  await runStep(shortlistKind, id, step, input, actor);
  return getShortlist(actor, id);
}

export const submitShortlist = (actor: Actor, id: number, lockVersion: number) => stepShortlist(actor, id, 'submit', { lockVersion });
export const checkShortlist = (actor: Actor, id: number, lockVersion: number, comment: string | undefined) => stepShortlist(actor, id, 'check', { lockVersion, comment });
export const returnShortlist = (actor: Actor, id: number, lockVersion: number, comment: string) => stepShortlist(actor, id, 'return', { lockVersion, comment });

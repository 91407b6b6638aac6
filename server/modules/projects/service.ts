import { Op, type Transaction } from 'sequelize';
import type { z } from 'zod';
import { sequelize } from '../../db/sequelize';
import { User } from '../../db/models';
import { DesignRecord, LoadCaseRecord, Project, ProjectMember, Shortlist } from '../../db/models/projects';
import type {
  LoadCaseDto,
  ProjectDto,
  UserSummaryDto,
  loadCaseSaveSchema,
  loadCaseUpdateSchema,
  projectCreateSchema,
  projectUpdateSchema,
} from '../../../shared/schemas/projects';
import { badRequest, conflict, notFound } from '../../errors';
import { recordAudit } from '../../services/audit';
import { assertCurrent, lockCurrent } from '../../services/optimistic-lock';
import { ownedProject, visibleProject, writableProject, isAdmin, type Actor } from './access';

export const userSummary = (u: User): UserSummaryDto => ({ id: u.id, name: u.name, email: u.email, role: u.role });

async function projectDto(project: Project, transaction?: Transaction): Promise<ProjectDto> {
  // One after another: queries inside a transaction share its single connection.
  const owner = await User.findByPk(project.ownerId, { transaction });
  const members = await User.findAll({
    where: { id: { [Op.in]: sequelize().literal(`(SELECT user_id FROM project_members WHERE project_id = ${Number(project.id)})`) } },
    order: [['name', 'ASC']],
    transaction,
  });
  const loadCases = await LoadCaseRecord.count({ where: { projectId: project.id }, transaction });
  const shortlists = await Shortlist.count({ where: { projectId: project.id }, transaction });
  const checked = await Shortlist.count({ where: { projectId: project.id, status: 'checked' }, transaction });
  const awaitingCheck = await Shortlist.count({ where: { projectId: project.id, status: 'submitted' }, transaction });
  return {
    id: project.id,
    name: project.name,
    description: project.description,
    owner: userSummary(owner!),
    members: members.map(userSummary),
    createdAt: project.createdAt.toISOString(),
    updatedAt: project.updatedAt.toISOString(),
    lockVersion: project.lockVersion,
    counts: { loadCases, shortlists, checked, awaitingCheck },
  };
}

export async function listProjects(actor: Actor): Promise<ProjectDto[]> {
  const where = isAdmin(actor)
    ? {}
    : { id: { [Op.in]: sequelize().literal(`(SELECT project_id FROM project_members WHERE user_id = ${Number(actor.id)})`) } };
  const projects = await Project.findAll({ where, order: [['updatedAt', 'DESC']] });
  return Promise.all(projects.map((p) => projectDto(p)));
}

export async function getProject(actor: Actor, projectId: number): Promise<ProjectDto> {
  return projectDto(await visibleProject(actor, projectId));
}

export async function createProject(actor: Actor, input: z.output<typeof projectCreateSchema>): Promise<ProjectDto> {
  return sequelize().transaction(async (transaction) => {
    const project = await Project.create({ ...input, ownerId: actor.id }, { transaction });
    await ProjectMember.create({ projectId: project.id, userId: actor.id, addedById: actor.id }, { transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'create', entityType: 'project', entityId: String(project.id), before: null, after: input });
    return projectDto(project, transaction);
  });
}

export async function updateProject(actor: Actor, projectId: number, input: z.output<typeof projectUpdateSchema>): Promise<ProjectDto> {
  return sequelize().transaction(async (transaction) => {
    await ownedProject(actor, projectId, transaction);
    const project = await lockCurrent(Project, transaction, projectId, input.lockVersion, 'Project', 'project');
    const before = { name: project.name, description: project.description };
    const { lockVersion: _read, ...change } = input;
    project.set(change);
    // Saved even when nothing changed, so the version moves on with every accepted edit.
    project.changed('updatedAt' as never, true);
    await project.save({ transaction });
    await recordAudit(transaction, { actorId: actor.id, action: 'update', entityType: 'project', entityId: String(projectId), before, after: change });
    return projectDto(project, transaction);
  });
}

export async function addMember(actor: Actor, projectId: number, userId: number): Promise<ProjectDto> {
  return sequelize().transaction(async (transaction) => {
    const project = await ownedProject(actor, projectId, transaction);
    const user = await User.findByPk(userId, { transaction });
    if (!user || !user.active) throw badRequest('That person has no active account.', { userId: 'no active account has this id' });
    const [, created] = await ProjectMember.findOrCreate({ where: { projectId, userId }, defaults: { projectId, userId, addedById: actor.id }, transaction });
    if (created) await recordAudit(transaction, { actorId: actor.id, action: 'add-member', entityType: 'project', entityId: String(projectId), before: null, after: { userId, name: user.name } });
    return projectDto(project, transaction);
  });
}

export async function removeMember(actor: Actor, projectId: number, userId: number): Promise<ProjectDto> {
  return sequelize().transaction(async (transaction) => {
    const project = await ownedProject(actor, projectId, transaction);
    if (userId === project.ownerId) throw conflict("The project's owner stays a member.", 'owner_is_member');
    const removed = await ProjectMember.destroy({ where: { projectId, userId }, transaction });
    if (!removed) throw notFound('Member');
    await recordAudit(transaction, { actorId: actor.id, action: 'remove-member', entityType: 'project', entityId: String(projectId), before: { userId }, after: null });
    return projectDto(project, transaction);
  });
}

/** Active people who can be added to a project. */
export async function directory(): Promise<UserSummaryDto[]> {
  const users = await User.findAll({ where: { active: true }, order: [['name', 'ASC']] });
  return users.map(userSummary);
}

// ---- Load cases ----------------------------------------------------------------------------

export function loadCaseDto(lc: LoadCaseRecord): LoadCaseDto {
  return {
    id: lc.id,
    projectId: lc.projectId,
    name: lc.name,
    loadCase: lc.loadCase,
    filters: (lc.filters as LoadCaseDto['filters']) ?? null,
    notes: lc.notes,
    createdBy: lc.createdBy ? userSummary(lc.createdBy) : null,
    lockVersion: lc.lockVersion,
    updatedAt: lc.updatedAt.toISOString(),
  };
}

const withCreator = [{ model: User, as: 'createdBy' }];

export async function listLoadCases(actor: Actor, projectId: number): Promise<LoadCaseDto[]> {
  await visibleProject(actor, projectId);
  const rows = await LoadCaseRecord.findAll({ where: { projectId }, include: withCreator, order: [['updatedAt', 'DESC']] });
  return rows.map(loadCaseDto);
}

/** A load case the actor may see (through its project). */
export async function visibleLoadCase(actor: Actor, loadCaseId: number, transaction?: Transaction): Promise<LoadCaseRecord> {
  const lc = await LoadCaseRecord.findByPk(loadCaseId, { include: withCreator, transaction });
  if (!lc) throw notFound('Load case');
  await visibleProject(actor, lc.projectId, transaction).catch(() => {
    throw notFound('Load case');
  });
  return lc;
}

export async function getLoadCase(actor: Actor, loadCaseId: number): Promise<LoadCaseDto> {
  return loadCaseDto(await visibleLoadCase(actor, loadCaseId));
}

export async function createLoadCase(actor: Actor, projectId: number, input: z.output<typeof loadCaseSaveSchema>): Promise<LoadCaseDto> {
  return sequelize().transaction(async (transaction) => {
    await writableProject(actor, projectId, transaction);
    const lc = await LoadCaseRecord.create(
      { projectId, name: input.name, loadCase: input.loadCase, filters: input.filters ?? null, notes: input.notes, createdById: actor.id },
      { transaction },
    );
    await recordAudit(transaction, { actorId: actor.id, action: 'create', entityType: 'load-case', entityId: String(lc.id), before: null, after: input });
    return loadCaseDto(await lc.reload({ include: withCreator, transaction }));
  });
}

export async function updateLoadCase(actor: Actor, loadCaseId: number, input: z.output<typeof loadCaseUpdateSchema>): Promise<LoadCaseDto> {
  return sequelize().transaction(async (transaction) => {
    const lc = await lockCurrent(LoadCaseRecord, transaction, loadCaseId, null, 'Load case');
    await writableProject(actor, lc.projectId, transaction).catch((err) => {
      throw err.status === 404 ? notFound('Load case') : err;
    });
    assertCurrent(lc, input.lockVersion, 'load case');
    // A load case used by a checked shortlist is part of a frozen record: keep it as it was.
    const frozen = await DesignRecord.count({
      where: { shortlistId: { [Op.in]: sequelize().literal(`(SELECT id FROM shortlists WHERE load_case_id = ${Number(loadCaseId)})`) } },
      transaction,
    });
    if (frozen) throw conflict('A checked shortlist uses this load case; save a new load case instead.', 'frozen');
    const before = { name: lc.name, loadCase: lc.loadCase, filters: lc.filters, notes: lc.notes };
    await lc.update(
      { name: input.name, loadCase: input.loadCase, filters: input.filters ?? null, notes: input.notes },
      { transaction },
    );
    // A shortlist read before this edit must not be submitted or checked on the strength of that
    // read: every live shortlist on this load case moves to a new version (a stale step gets 409).
    // (Raw SQL: Model.increment does not map lockVersion to its underscored column.)
    await sequelize().query(
      `UPDATE shortlists SET lock_version = lock_version + 1, updated_at = now() WHERE load_case_id = :id AND status IN ('open', 'submitted', 'returned')`,
      { replacements: { id: lc.id }, transaction },
    );
    await recordAudit(transaction, { actorId: actor.id, action: 'update', entityType: 'load-case', entityId: String(lc.id), before, after: input });
    return loadCaseDto(await lc.reload({ include: withCreator, transaction }));
  });
}

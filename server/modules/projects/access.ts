import type { Transaction } from 'sequelize';
import { can, type Role } from '../../../shared/schemas/auth';
import { forbidden, notFound } from '../../errors';
import { Project, ProjectMember } from '../../db/models/projects';

export interface Actor {
  id: number;
  role: Role;
}

export const isAdmin = (actor: Actor) => actor.role === 'admin';

/**
 * The project if the actor may see it: admins see every project, everyone else only those
 * they are a member of. Anything else is "not found", so a project's existence is not revealed.
 */
export async function visibleProject(actor: Actor, projectId: number, transaction?: Transaction): Promise<Project> {
  // A read, not a lock: edits lock the row they change (shortlist, load case), so edits in one
  // project do not queue behind each other.
  const project = await Project.findByPk(projectId, { transaction });
  if (!project) throw notFound('Project');
  if (isAdmin(actor)) return project;
  const member = await ProjectMember.findOne({ where: { projectId, userId: actor.id }, transaction });
  if (!member) throw notFound('Project');
  return project;
}

/** Members with write permission may add load cases and shortlists. */
export async function writableProject(actor: Actor, projectId: number, transaction?: Transaction): Promise<Project> {
  const project = await visibleProject(actor, projectId, transaction);
  if (!can(actor.role, 'project:write')) throw forbidden();
  return project;
}

/** Members are managed by the project's owner or an admin. */
export async function ownedProject(actor: Actor, projectId: number, transaction?: Transaction): Promise<Project> {
  const project = await visibleProject(actor, projectId, transaction);
  if (!isAdmin(actor) && project.ownerId !== actor.id) throw forbidden("Only the project's owner or an administrator can change its members.");
  return project;
}

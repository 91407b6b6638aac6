import type { Request } from 'express';
import { can } from '../../shared/schemas/auth';
import type { Role } from '../../shared/roles';

/** Who is calling, for services: behind `authorize()`, so a user is signed in. */
export const actorOf = (req: Request): { id: number; name: string; role: Role } => ({ id: req.user!.id, name: req.user!.name, role: req.user!.role });

/** The JSON body, or an empty object when none was sent (the schema then names what is missing). */
export const bodyOf = (req: Request): unknown => (req as { body?: unknown }).body ?? {};

/** What a reader of the catalogue may see beyond published records: drafts, for those who may draft. */
export const draftViewerOf = (req: Request): { canDraft: boolean } => ({ canDraft: can(req.user?.role, 'catalogue:draft') });

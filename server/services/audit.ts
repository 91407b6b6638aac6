// The audit log: who changed what, when, with the state before and after. Written in the same
// transaction as the change it describes, so a rolled-back change leaves no entry.
import type { Transaction } from 'sequelize';
import { AuditEntry } from '../db/models';

/** The kinds the admin's audit filter offers; other modules may record their own kinds too. */
export type AuditEntityType =
  | 'property-set'
  | 'reference'
  | 'material'
  | 'import'
  | 'user'
  | 'project'
  | 'shortlist'
  | (string & Record<never, never>);

export interface AuditInput {
  actorId: number | null;
  /** A verb in the domain's words: create, edit, submit, approve, return, revise, retire, supersede, import, upload… */
  action: string;
  entityType: AuditEntityType;
  entityId: number | string | null;
  before?: unknown;
  after?: unknown;
}

/** JSON-safe copy: Dates become ISO strings, undefined becomes null. */
function json(value: unknown): unknown {
  if (value === undefined) return null;
  return JSON.parse(JSON.stringify(value)) as unknown;
}

export async function recordAudit(transaction: Transaction, entry: AuditInput): Promise<void> {
  await AuditEntry.create(
    {
      actorId: entry.actorId,
      action: entry.action,
      entityType: entry.entityType,
      entityId: entry.entityId === null ? null : String(entry.entityId),
      before: json(entry.before),
      after: json(entry.after),
    },
    { transaction },
  );
}

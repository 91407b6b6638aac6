// Optimistic locking, one way for every versioned table. Each such model declares
// `version: 'lockVersion'`, so Sequelize bumps the column on every save; a write names the lock
// version it read, and the row is read FOR UPDATE and compared with it inside the transaction.
import type { Model, ModelStatic, Transaction } from 'sequelize';
import { conflict, notFound } from '../errors';

export const staleMessage = (noun = 'record') =>
  `Someone saved this ${noun} after you opened it. Reload to see their changes; your edits are still in the form.`;
export const stale = (noun?: string) => conflict(staleMessage(noun), 'stale');

type Versioned = Model & { lockVersion: number };

/** Refuses a write made from an older read. */
export function assertCurrent(row: Versioned, lockVersion: number | null | undefined, noun?: string): void {
  if (lockVersion !== null && lockVersion !== undefined && row.lockVersion !== lockVersion) throw stale(noun);
}

/**
 * Reads the row with SELECT … FOR UPDATE (concurrent writes to it queue) and checks the lock
 * version the caller read; null skips the check (a change that cannot be stale, like adding an item).
 */
export async function lockCurrent<M extends Versioned>(
  model: ModelStatic<M>,
  transaction: Transaction,
  id: number,
  lockVersion: number | null | undefined,
  what: string,
  noun?: string,
): Promise<M> {
  const row = await model.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
  if (!row) throw notFound(what);
  assertCurrent(row, lockVersion, noun);
  return row;
}

/** Saves a row whose children changed (e.g. a shortlist's items), so its lock version moves on. */
export async function touch(row: Versioned, transaction: Transaction): Promise<void> {
  row.changed('updatedAt' as never, true);
  await row.save({ transaction });
}

/** The row as stored, for the audit log's before/after. */
export function auditSnapshot(row: Model): Record<string, unknown> {
  const { createdAt: _c, updatedAt: _u, ...rest } = row.get({ plain: true }) as Record<string, unknown>;
  return rest;
}

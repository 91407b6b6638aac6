// Sign-in throttle, kept in PostgreSQL (table sign_in_throttles) so it survives restarts and every
// process shares it. Failures are counted twice: per address across every name (password
// spraying), and per address and name (guessing one account's password). A lock is checked before
// the password, but only the locks of the caller's own address: a correct password from an address
// that has not failed is never refused because of failures made elsewhere.
// See docs/decisions/025-sign-in-throttle.md.
import type { Request } from 'express';
import { ipKeyGenerator } from 'express-rate-limit';
import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { env } from '../config/env';

export interface ThrottleRule {
  /** Failures allowed before the first lock. */
  free: number;
  /** The first lock; each further failure doubles it… */
  baseMs: number;
  /** …up to this. */
  maxMs: number;
  /** A counter with no failure for this long starts again from zero. */
  quietMs: number;
}

/** One address and one account name: five tries, then 30 s doubling to 15 min; forgotten after a quiet day. */
export const PER_NAME: ThrottleRule = { free: 5, baseMs: 30_000, maxMs: 15 * 60_000, quietMs: 24 * 3600_000 };

/** One address across every name: LOGIN_RATE_LIMIT tries (10 unless set), then 60 s doubling to 1 h; forgotten after a quiet hour. */
export const perAddress = (): ThrottleRule => ({ free: env().LOGIN_RATE_LIMIT, baseMs: 60_000, maxMs: 3600_000, quietMs: 3600_000 });

/**
 * The caller's address as the throttle counts it: req.ip (the socket's peer unless `trust proxy`
 * is configured), IPv4-mapped addresses as IPv4, IPv6 by /56 network (one subscriber's block).
 */
export const clientAddress = (req: Request): string => ipKeyGenerator(req.ip ?? req.socket.remoteAddress ?? 'unknown');

export interface ThrottleLock {
  /** 'address': every name from this address waits; 'name': this name from this address waits. */
  scope: 'address' | 'name';
  retryAfterMs: number;
}

/** The lock that applies to this address and name now, the longer one if both do; null when none does. */
export async function activeLock(address: string, email: string): Promise<ThrottleLock | null> {
  const rows = await sequelize().query<{ email: string; wait_ms: string }>(
    `SELECT email, ceil(extract(epoch FROM locked_until - now()) * 1000)::bigint AS wait_ms
       FROM sign_in_throttles WHERE address = :address AND email IN ('', :email) AND locked_until > now()`,
    { replacements: { address, email }, type: QueryTypes.SELECT },
  );
  let lock: ThrottleLock | null = null;
  for (const r of rows) {
    const wait = Number(r.wait_ms);
    if (!lock || wait > lock.retryAfterMs) lock = { scope: r.email === '' ? 'address' : 'name', retryAfterMs: wait };
  }
  return lock;
}

/**
 * One atomic upsert per counter: the count restarts after a quiet period, and from `free`
 * failures on the row is locked for base × 2^(failures − free), at most max.
 */
async function countFailure(address: string, email: string, rule: ThrottleRule): Promise<void> {
  const previous = `(CASE WHEN t.last_failure_at < now() - make_interval(secs => :quietS) THEN 0 ELSE t.failures END)`;
  const lockFor = (failures: string) =>
    `CASE WHEN ${failures} >= :free THEN now() + make_interval(secs => LEAST(:maxS, :baseS * power(2, ${failures} - :free))) END`;
  await sequelize().query(
    `INSERT INTO sign_in_throttles AS t (address, email, failures, locked_until, last_failure_at)
       VALUES (:address, :email, 1, ${lockFor('1')}, now())
     ON CONFLICT (address, email) DO UPDATE SET
       failures = ${previous} + 1,
       locked_until = ${lockFor(`(${previous} + 1)`)},
       last_failure_at = now()`,
    { replacements: { address, email, free: rule.free, quietS: rule.quietMs / 1000, baseS: rule.baseMs / 1000, maxS: rule.maxMs / 1000 } },
  );
}

let lastPrune = 0;

/** Counts a wrong password (or an unknown name: alike, so a lock says nothing about who has an account). */
export async function recordFailure(address: string, email: string): Promise<void> {
  await countFailure(address, '', perAddress());
  await countFailure(address, email, PER_NAME);
  // Forgotten counters go, at most once every ten minutes per process.
  if (Date.now() - lastPrune > 10 * 60_000) {
    lastPrune = Date.now();
    await pruneThrottles();
  }
}

/** A correct password clears this address's counter for the name (not the address's own: one good account must not wash a spray clean). */
export async function recordSuccess(address: string, email: string): Promise<void> {
  await sequelize().query(`DELETE FROM sign_in_throttles WHERE address = :address AND email = :email`, { replacements: { address, email } });
}

/** Deletes counters that are neither locked nor within their quiet period. */
export async function pruneThrottles(): Promise<number> {
  const [, result] = await sequelize().query(
    `DELETE FROM sign_in_throttles
      WHERE (locked_until IS NULL OR locked_until < now())
        AND last_failure_at < now() - make_interval(secs => CASE WHEN email = '' THEN :addressS ELSE :nameS END)`,
    { replacements: { addressS: perAddress().quietMs / 1000, nameS: PER_NAME.quietMs / 1000 } },
  );
  return (result as { rowCount?: number })?.rowCount ?? 0;
}

export interface ThrottleRow {
  id: number;
  address: string;
  email: string;
  failures: number;
  lockedUntil: Date | null;
  lastFailureAt: Date;
}

/** Counters still remembered (locked or within their quiet period), locked ones first. */
export async function listThrottles(limit = 200): Promise<ThrottleRow[]> {
  const rows = await sequelize().query<{ id: number; address: string; email: string; failures: number; locked_until: Date | null; last_failure_at: Date }>(
    `SELECT id, address, email, failures, locked_until, last_failure_at FROM sign_in_throttles
      WHERE locked_until > now()
         OR last_failure_at >= now() - make_interval(secs => CASE WHEN email = '' THEN :addressS ELSE :nameS END)
      ORDER BY (locked_until > now()) IS TRUE DESC, last_failure_at DESC, id DESC
      LIMIT :limit`,
    { replacements: { limit, addressS: perAddress().quietMs / 1000, nameS: PER_NAME.quietMs / 1000 }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ id: r.id, address: r.address, email: r.email, failures: r.failures, lockedUntil: r.locked_until, lastFailureAt: r.last_failure_at }));
}

/** Deletes one counter (the admin's "clear"); returns the row as it was, or null when there was none. */
export async function clearThrottle(id: number, transaction?: Transaction): Promise<ThrottleRow | null> {
  const rows = await sequelize().query<{ id: number; address: string; email: string; failures: number; locked_until: Date | null; last_failure_at: Date }>(
    `DELETE FROM sign_in_throttles WHERE id = :id RETURNING id, address, email, failures, locked_until, last_failure_at`,
    { replacements: { id }, type: QueryTypes.SELECT, transaction },
  );
  const r = rows[0];
  return r ? { id: r.id, address: r.address, email: r.email, failures: r.failures, lockedUntil: r.locked_until, lastFailureAt: r.last_failure_at } : null;
}

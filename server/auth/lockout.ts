import { LRUCache } from 'lru-cache';

/**
 * Back-off per account name after repeated failed sign-ins: after FREE_FAILURES failures the
 * name is locked for BASE_LOCK_MS, doubling with each further failure up to MAX_LOCK_MS. Names
 * without an account back off exactly the same way, so a lock says nothing about whether an
 * account exists. Counted per name (across addresses); the per-address limiter sits in front.
 */
export const FREE_FAILURES = 5;
export const BASE_LOCK_MS = 30_000;
export const MAX_LOCK_MS = 15 * 60_000;

interface Record {
  failures: number;
  lockedUntil: number;
}

const records = new LRUCache<string, Record>({ max: 50_000, ttl: 24 * 3600_000 });

/** Milliseconds the name must still wait, or 0. */
export function lockRemaining(email: string, now = Date.now()): number {
  const r = records.get(email);
  return r && r.lockedUntil > now ? r.lockedUntil - now : 0;
}

export function recordFailure(email: string, now = Date.now()): void {
  const r = records.get(email) ?? { failures: 0, lockedUntil: 0 };
  r.failures += 1;
  if (r.failures >= FREE_FAILURES) {
    const lock = Math.min(MAX_LOCK_MS, BASE_LOCK_MS * 2 ** (r.failures - FREE_FAILURES));
    r.lockedUntil = now + lock;
  }
  records.set(email, r);
}

export function recordSuccess(email: string): void {
  records.delete(email);
}

/** Tests only. */
export function resetLockouts(): void {
  records.clear();
}

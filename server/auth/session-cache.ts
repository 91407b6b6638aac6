import type { SessionData, Store } from 'express-session';
import { LRUCache } from 'lru-cache';

type Callback<T> = (err: unknown, value?: T | null) => void;
type Sess = SessionData & { passport?: { user?: number } };

/**
 * Keeps recently read sessions in memory in front of the PostgreSQL store, so a signed-in request
 * usually costs no session query. Writes and deletions go through to PostgreSQL and update the
 * cache; sessions ended outside the store (deactivation, password reset) are dropped with
 * `forgetSessionsOf`. Entries live at most a minute, and an expired session is never served.
 */
interface Entry {
  /** The session as PostgreSQL stores it (JSON through Cookie.toJSON); parsed afresh per read. */
  json: string;
  userId: number | undefined;
  expires: number;
}
const cache = new LRUCache<string, Entry>({ max: 20_000, ttl: 60_000 });

export function forgetSessionsOf(userId: number): void {
  for (const [sid, entry] of cache.entries()) if (entry.userId === userId) cache.delete(sid);
}

export function forgetAllSessions(): void {
  cache.clear();
}

function entryOf(sess: SessionData): Entry {
  const s = sess as Sess;
  const expires = s.cookie?.expires;
  return {
    json: JSON.stringify(sess),
    userId: s.passport?.user,
    expires: expires === undefined || expires === null ? Number.POSITIVE_INFINITY : new Date(expires).getTime(),
  };
}

export function withSessionCache<S extends Store>(store: S): S {
  const get = store.get.bind(store);
  const set = store.set.bind(store);
  const destroy = store.destroy.bind(store);
  store.get = (sid: string, fn: Callback<SessionData>) => {
    const hit = cache.get(sid);
    // Each request gets its own object: express-session mutates what the store hands it.
    if (hit && hit.expires > Date.now()) return fn(null, JSON.parse(hit.json) as SessionData);
    get(sid, (err: unknown, sess?: SessionData | null) => {
      if (!err && sess) cache.set(sid, entryOf(sess));
      fn(err, sess);
    });
  };
  store.set = (sid: string, sess: SessionData, fn?: (err?: unknown) => void) => {
    cache.delete(sid);
    set(sid, sess, (err?: unknown) => {
      if (!err) cache.set(sid, entryOf(sess));
      fn?.(err);
    });
  };
  store.destroy = (sid: string, fn?: (err?: unknown) => void) => {
    cache.delete(sid);
    destroy(sid, (err?: unknown) => fn?.(err));
  };
  return store;
}

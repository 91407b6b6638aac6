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
const cache = new LRUCache<string, Sess>({ max: 20_000, ttl: 60_000 });

export function forgetSessionsOf(userId: number): void {
  for (const [sid, sess] of cache.entries()) if (sess.passport?.user === userId) cache.delete(sid);
}

export function forgetAllSessions(): void {
  cache.clear();
}

/** The shape PostgreSQL would hand back (JSON, through Cookie.toJSON), and never a shared object. */
const copy = (sess: SessionData): Sess => JSON.parse(JSON.stringify(sess)) as Sess;

const expired = (sess: Sess) => {
  const expires = sess.cookie?.expires;
  return expires !== undefined && expires !== null && new Date(expires).getTime() <= Date.now();
};

export function withSessionCache<S extends Store>(store: S): S {
  const get = store.get.bind(store);
  const set = store.set.bind(store);
  const destroy = store.destroy.bind(store);
  store.get = (sid: string, fn: Callback<SessionData>) => {
    const hit = cache.get(sid);
    // Each request gets its own copy: express-session mutates what the store hands it.
    if (hit && !expired(hit)) return fn(null, copy(hit));
    get(sid, (err: unknown, sess?: SessionData | null) => {
      if (!err && sess) cache.set(sid, copy(sess));
      fn(err, sess);
    });
  };
  store.set = (sid: string, sess: SessionData, fn?: (err?: unknown) => void) => {
    cache.delete(sid);
    set(sid, sess, (err?: unknown) => {
      if (!err) cache.set(sid, copy(sess));
      fn?.(err);
    });
  };
  store.destroy = (sid: string, fn?: (err?: unknown) => void) => {
    cache.delete(sid);
    destroy(sid, (err?: unknown) => fn?.(err));
  };
  return store;
}

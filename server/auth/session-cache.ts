import type { SessionData, Store } from 'express-session';
import { LRUCache } from 'lru-cache';
import { announce, cachesUsable, onChange, sessionKey } from '../services/change-feed';

type Callback<T> = (err: unknown, value?: T | null) => void;
type Sess = SessionData & { passport?: { user?: number } };

/**
 * Keeps recently read sessions in memory in front of the PostgreSQL store, so a signed-in request
 * usually costs no session query. Writes and deletions go through to PostgreSQL, then are
 * announced on the change feed so every process drops its copy; sessions ended outside the store
 * (deactivation, password reset) are announced by whoever ended them ({ kind: 'sessions' }).
 * Entries are keyed by a hash of the session id, live at most a minute, and an expired session is
 * never served. While the change feed is not listening, nothing is served from or kept in memory.
 */
interface Entry {
  /** The session as PostgreSQL stores it (JSON through Cookie.toJSON); parsed afresh per read. */
  json: string;
  userId: number | undefined;
  expires: number;
}
const cache = new LRUCache<string, Entry>({ max: 20_000, ttl: 60_000 });
// Bumped by every change: a read that started before a change is not kept after it.
let generation = 0;

function forgetSessionsOf(userId: number): void {
  for (const [key, entry] of cache.entries()) if (entry.userId === userId) cache.delete(key);
}

export function forgetAllSessions(): void {
  generation++;
  cache.clear();
}

onChange((change) => {
  if (change.kind === 'session') {
    generation++;
    cache.delete(change.key);
  } else if (change.kind === 'sessions') {
    generation++;
    forgetSessionsOf(change.userId);
  } else if (change.kind === 'everything') forgetAllSessions();
});

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
    const key = sessionKey(sid);
    const usable = cachesUsable();
    const hit = usable ? cache.get(key) : undefined;
    // Each request gets its own object: express-session mutates what the store hands it.
    if (hit && hit.expires > Date.now()) return fn(null, JSON.parse(hit.json) as SessionData);
    const started = generation;
    get(sid, (err: unknown, sess?: SessionData | null) => {
      if (!err && sess && usable && cachesUsable() && generation === started) cache.set(key, entryOf(sess));
      fn(err, sess);
    });
  };
  store.set = (sid: string, sess: SessionData, fn?: (err?: unknown) => void) => {
    const key = sessionKey(sid);
    cache.delete(key);
    set(sid, sess, (err?: unknown) => {
      if (err) return fn?.(err);
      // The others drop their copy; this process keeps the one just written.
      announce({ kind: 'session', key }).then(
        () => {
          if (cachesUsable()) cache.set(key, entryOf(sess));
          fn?.();
        },
        (e: unknown) => fn?.(e),
      );
    });
  };
  store.destroy = (sid: string, fn?: (err?: unknown) => void) => {
    const key = sessionKey(sid);
    cache.delete(key);
    destroy(sid, (err?: unknown) => {
      if (err) return fn?.(err);
      announce({ kind: 'session', key }).then(
        () => fn?.(),
        (e: unknown) => fn?.(e),
      );
    });
  };
  return store;
}

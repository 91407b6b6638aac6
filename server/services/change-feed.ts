import { createHash } from 'node:crypto';
import pg from 'pg';
import type { Transaction } from 'sequelize';
import { changeFeedUrl } from '../config/env';
import { sequelize } from '../db/sequelize';

/**
 * The change feed: how every process serving one database learns that something it keeps in
 * memory has changed (docs/decisions/022-change-feed.md).
 *
 * A change is announced with PostgreSQL's NOTIFY on one channel. Announced inside a transaction,
 * the notification is sent by PostgreSQL only when that transaction commits (and never if it
 * rolls back); the announcing process also applies it itself right after the commit, so the
 * answer to the request that made the change already reflects it. Every process LISTENs on a
 * connection of its own and applies what it hears. While that connection is down, notifications
 * may be missed: the process drops everything it caches and serves uncached (`cachesUsable()` is
 * false) until it is listening again.
 */
export const CHANGE_CHANNEL = 'isobath_changes';

export type Change =
  /** An account was written (role, name, active, password); null: any account (a bulk write). */
  | { kind: 'account'; userId: number | null }
  /** Every stored session of an account was ended (deactivation, password reset or change). */
  | { kind: 'sessions'; userId: number }
  /** One session was written or ended; `key` is sessionKey(sid), never the session id itself. */
  | { kind: 'session'; key: string }
  /** The published catalogue (property sets, rating tables) may have changed. */
  | { kind: 'catalogue' }
  /** Anything may have changed (raw SQL from a script, a lost listening connection). */
  | { kind: 'everything' };

type Apply = (change: Change) => void;
const appliers: Apply[] = [];

/** Registers what a cache drops for a change; called once per cache module. */
export function onChange(apply: Apply): void {
  appliers.push(apply);
}

/** The key a session goes by in caches and notifications: its id is a bearer secret. */
export const sessionKey = (sid: string): string => createHash('sha256').update(sid).digest('base64url').slice(0, 22);

function applyLocally(change: Change): void {
  for (const apply of appliers) apply(change);
}

const rootOf = (t: Transaction): Transaction => {
  let root = t as Transaction & { parent?: Transaction };
  while (root.parent) root = root.parent as Transaction & { parent?: Transaction };
  return root;
};

/**
 * Announces a change to every process. With a transaction the notification goes out when it
 * commits and this process applies it after the commit; without, at once.
 */
export async function announce(change: Change, transaction?: Transaction | null): Promise<void> {
  const replacements = { channel: CHANGE_CHANNEL, payload: JSON.stringify(change) };
  if (transaction) {
    await sequelize().query('SELECT pg_notify(:channel, :payload)', { replacements, transaction });
    rootOf(transaction).afterCommit(() => applyLocally(change));
    return;
  }
  applyLocally(change);
  // A write already committed: tell the others. If the database is unreachable there is nobody
  // to tell (and the others' listening connections are down too, so they serve uncached).
  await sequelize()
    .query('SELECT pg_notify(:channel, :payload)', { replacements })
    .catch(() => undefined);
}

function parse(payload: string | undefined): Change {
  try {
    const c = JSON.parse(payload ?? '') as Change;
    if (c && typeof c === 'object' && ['account', 'sessions', 'session', 'catalogue', 'everything'].includes(c.kind)) return c;
  } catch {
    /* not ours: treat as the widest change */
  }
  return { kind: 'everything' };
}

// The listening connection: one per process, shared by every app created in it (tests create
// several), closed when the last one closes.
let users = 0;
let client: pg.Client | null = null;
let listening = false;
let retry: NodeJS.Timeout | null = null;
let backoff = 200;
let connecting: Promise<void> | null = null;

/** True while the process is listening: only then may it serve from its caches. */
export const cachesUsable = (): boolean => listening;

function lost(): void {
  listening = false;
  applyLocally({ kind: 'everything' });
  client = null;
  if (users > 0 && !retry) {
    retry = setTimeout(() => {
      retry = null;
      void connect();
    }, backoff);
    retry.unref();
    backoff = Math.min(backoff * 2, 5_000);
  }
}

function connect(): Promise<void> {
  if (connecting) return connecting;
  const c = new pg.Client({ connectionString: changeFeedUrl(), application_name: `isobath-change-feed:${process.pid}`, connectionTimeoutMillis: 3_000, keepAlive: true });
  connecting = (async () => {
    let failed = false;
    c.on('error', () => {
      failed = true;
      if (client === c) lost();
    });
    c.on('end', () => {
      if (client === c) lost();
    });
    c.on('notification', (msg) => {
      if (msg.channel === CHANGE_CHANNEL) applyLocally(parse(msg.payload));
    });
    try {
      await c.connect();
      await c.query(`LISTEN ${CHANGE_CHANNEL}`);
      if (failed || users === 0) throw new Error('closed while connecting');
      client = c;
      backoff = 200;
      // Whatever changed while not listening went unheard: start from empty caches.
      applyLocally({ kind: 'everything' });
      listening = true;
    } catch {
      await c.end().catch(() => undefined);
      if (users > 0) {
        client = null;
        lost();
      }
    } finally {
      connecting = null;
    }
  })();
  return connecting;
}

/** Starts listening (once per process); resolves when listening or when the first try failed. */
export function startChangeFeed(): Promise<void> {
  users++;
  if (client || connecting) return connecting ?? Promise.resolve();
  return connect();
}

/** Stops listening when the last app of the process closes. */
export async function stopChangeFeed(): Promise<void> {
  users = Math.max(0, users - 1);
  if (users > 0) return;
  if (retry) clearTimeout(retry);
  retry = null;
  await connecting;
  const c = client;
  client = null;
  listening = false;
  applyLocally({ kind: 'everything' });
  await c?.end().catch(() => undefined);
}

/** The backend process id of the listening connection (tests kill it to check recovery). */
export async function listenerPid(): Promise<number | null> {
  if (!client) return null;
  const { rows } = await client.query<{ pid: number }>('SELECT pg_backend_pid() AS pid');
  return rows[0]?.pid ?? null;
}

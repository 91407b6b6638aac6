import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import session from 'express-session';
import { withSessionCache } from '../../server/auth/session-cache';
import { announce, cachesUsable, startChangeFeed, stopChangeFeed } from '../../server/services/change-feed';
import { closeDatabase } from '../../server/db/sequelize';

// The cache serves from memory only while this process listens to the change feed (PostgreSQL).
beforeAll(async () => {
  await startChangeFeed();
  expect(cachesUsable()).toBe(true);
});
afterAll(async () => {
  await stopChangeFeed();
  await closeDatabase();
});

const get = (store: session.Store, sid: string) =>
  new Promise<session.SessionData | null | undefined>((resolve, reject) => store.get(sid, (err, s) => (err ? reject(err) : resolve(s))));
const set = (store: session.Store, sid: string, sess: object) =>
  new Promise<void>((resolve, reject) => store.set(sid, sess as session.SessionData, (err) => (err ? reject(err) : resolve())));

/** A store that counts reads, standing in for PostgreSQL. */
function countingStore() {
  const inner = new session.MemoryStore();
  let reads = 0;
  const origGet = inner.get.bind(inner);
  inner.get = (sid, fn) => {
    reads++;
    origGet(sid, fn);
  };
  return { store: withSessionCache(inner), reads: () => reads };
}

const sess = (user: number, expires: Date) => ({ cookie: { originalMaxAge: 1000, expires, httpOnly: true, path: '/' }, passport: { user } });

describe('session cache', () => {
  it('answers repeated reads from memory, each with its own copy', async () => {
    const { store, reads } = countingStore();
    await set(store, 'a', sess(7, new Date(Date.now() + 3600_000)));
    const one = (await get(store, 'a')) as unknown as { passport: { user?: number } };
    const two = (await get(store, 'a')) as unknown as { passport: { user?: number } };
    expect(reads()).toBe(0);
    delete one.passport.user;
    expect(two.passport.user).toBe(7);
    expect(((await get(store, 'a')) as unknown as { passport: { user: number } }).passport.user).toBe(7);
  });

  it('never serves an expired session from memory', async () => {
    const { store, reads } = countingStore();
    await set(store, 'old', sess(3, new Date(Date.now() - 1000)));
    expect(await get(store, 'old')).toBeFalsy();
    expect(reads()).toBe(1);
  });

  it("forgets a user's sessions when they are ended elsewhere", async () => {
    const { store, reads } = countingStore();
    await set(store, 'b', sess(9, new Date(Date.now() + 3600_000)));
    await announce({ kind: 'sessions', userId: 9 });
    await get(store, 'b');
    expect(reads()).toBe(1);
  });

  it('serves nothing from memory while the change feed is not listening', async () => {
    const { store, reads } = countingStore();
    await set(store, 'd', sess(5, new Date(Date.now() + 3600_000)));
    await stopChangeFeed();
    try {
      expect(cachesUsable()).toBe(false);
      await get(store, 'd');
      await get(store, 'd');
      expect(reads()).toBe(2);
    } finally {
      await startChangeFeed();
    }
    await get(store, 'd');
    await get(store, 'd');
    expect(reads()).toBe(3);
  });

  it('drops a destroyed session at once', async () => {
    const { store } = countingStore();
    await set(store, 'c', sess(4, new Date(Date.now() + 3600_000)));
    await new Promise<void>((resolve) => store.destroy('c', () => resolve()));
    expect(await get(store, 'c')).toBeFalsy();
  });
});

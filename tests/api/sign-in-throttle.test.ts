// The sign-in throttle. Reproduces findings 5 and 7 of the account-safety assessment: (5) anyone
// could keep any account locked (the per-name lock was checked before the password from every
// address, lived in process memory and could not be cleared); (7) spraying across names from one
// address was not limited, and a loopback client could name its own address in X-Forwarded-For.
// "Different addresses" are real ones: requests leave from 127.0.0.2, 127.0.0.3 … (loopback only).
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestApp, signIn, demoEmail, type Agent } from '../helpers/app';
import { serveOnLoopback, type Served } from '../helpers/from-address';
import { createApp } from '../../server/app';
import { env, resetEnvCache } from '../../server/config/env';
import { sequelize } from '../../server/db/sequelize';
import { User } from '../../server/db/models';
import { DEMO_PASSWORD } from '../../server/db/seeders/demo';
import { PER_NAME, perAddress } from '../../server/auth/sign-in-throttle';

let handle: Awaited<ReturnType<typeof startTestApp>>;
let served: Served;
let admin: Agent;
beforeAll(async () => {
  handle = await startTestApp();
  served = await serveOnLoopback(handle.app);
  admin = await signIn(handle.app, 'admin');
});
afterAll(async () => {
  await served.stop();
  await handle.stop();
});
beforeEach(async () => {
  await sequelize().query('TRUNCATE sign_in_throttles');
});

const ATTACKER = '127.0.0.2';
const VICTIM = '127.0.0.3';
const login = (from: string, email: string, password: string, headers?: Record<string, string>) => served.post(from, '/api/auth/login', { email, password }, headers);

/** Simulates the clock passing a lock: every lock ends now (the counts stay). */
const endLocks = () => sequelize().query('UPDATE sign_in_throttles SET locked_until = now() WHERE locked_until IS NOT NULL');

describe('per address and name', () => {
  it(`locks a name from the address that failed ${PER_NAME.free} times, whether or not the account exists, with Retry-After`, async () => {
    for (const email of [demoEmail('checker'), 'no.such.person@harrow.example']) {
      for (let i = 0; i < PER_NAME.free; i++) expect((await login(ATTACKER, email, 'wrong-password')).status).toBe(401);
      const locked = await login(ATTACKER, email, DEMO_PASSWORD);
      expect(locked.status).toBe(429);
      expect(locked.body.error.code).toBe('too_many_attempts');
      expect(Number(locked.headers['retry-after'])).toBe(PER_NAME.baseMs / 1000);
    }
  });

  it("never refuses the right password from another address because of someone else's failures", async () => {
    const victim = demoEmail('engineer');
    for (let i = 0; i < PER_NAME.free + 3; i++) await login(ATTACKER, victim, 'guess-' + i);
    expect((await login(ATTACKER, victim, DEMO_PASSWORD)).status).toBe(429);
    const own = await login(VICTIM, victim, DEMO_PASSWORD);
    expect(own.status).toBe(200);
    expect(own.body.user.email).toBe(victim);
    // The victim's success does not lift the attacker's lock.
    expect((await login(ATTACKER, victim, DEMO_PASSWORD)).status).toBe(429);
  });

  it('makes each further failure wait twice as long, up to the cap', async () => {
    const email = demoEmail('viewer');
    for (let i = 0; i < PER_NAME.free; i++) await login(ATTACKER, email, 'wrong-password');
    const waits: number[] = [];
    for (let round = 0; round < 7; round++) {
      waits.push(Number((await login(ATTACKER, email, 'wrong-password')).headers['retry-after']));
      await endLocks();
      expect((await login(ATTACKER, email, 'wrong-password')).status).toBe(401);
    }
    waits.push(Number((await login(ATTACKER, email, 'wrong-password')).headers['retry-after']));
    // 30 s, then doubling with each failure past the free ones, capped at 15 min.
    expect(waits).toEqual([30, 60, 120, 240, 480, 900, 900, 900]);
  });

  it('forgets the count once the right password is given from that address', async () => {
    const email = demoEmail('checker');
    for (let i = 0; i < PER_NAME.free - 1; i++) await login(ATTACKER, email, 'wrong-password');
    expect((await login(ATTACKER, email, DEMO_PASSWORD)).status).toBe(200);
    for (let i = 0; i < PER_NAME.free - 1; i++) expect((await login(ATTACKER, email, 'wrong-password')).status).toBe(401);
    expect((await login(ATTACKER, email, DEMO_PASSWORD)).status).toBe(200);
  });

  it('keeps the lock in PostgreSQL: a restarted app (or another process) still refuses', async () => {
    const email = demoEmail('librarian');
    for (let i = 0; i < PER_NAME.free; i++) await login(ATTACKER, email, 'wrong-password');
    const second = createApp();
    const again = await serveOnLoopback(second.app);
    try {
      const res = await again.post(ATTACKER, '/api/auth/login', { email, password: DEMO_PASSWORD });
      expect(res.status).toBe(429);
      expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
    } finally {
      await again.stop();
      await second.close();
    }
  });
});

describe('per address, across names (password spraying)', () => {
  it('throttles an address after LOGIN_RATE_LIMIT failures over different names, even for a right password; other addresses are unaffected', async () => {
    const free = perAddress().free;
    expect(free).toBe(env().LOGIN_RATE_LIMIT);
    for (let i = 0; i < free; i++) expect((await login(ATTACKER, `crew.${i}@harrow.example`, 'Winter2026!')).status).toBe(401);
    const sprayed = await login(ATTACKER, 'crew.next@harrow.example', 'Winter2026!');
    expect(sprayed.status).toBe(429);
    expect(Number(sprayed.headers['retry-after'])).toBe(perAddress().baseMs / 1000);
    expect(sprayed.body.error.message).toMatch(/from your network/);
    expect((await login(ATTACKER, demoEmail('engineer'), DEMO_PASSWORD)).status).toBe(429);
    expect((await login(VICTIM, demoEmail('engineer'), DEMO_PASSWORD)).status).toBe(200);
  });
});

describe('X-Forwarded-For and trust proxy', () => {
  it('ignores X-Forwarded-For from loopback by default: every failure counts against the real address', async () => {
    const email = demoEmail('checker');
    for (let i = 0; i < PER_NAME.free; i++) {
      expect((await login(ATTACKER, email, 'wrong-password', { 'X-Forwarded-For': `198.51.100.${i + 1}` })).status).toBe(401);
    }
    expect((await login(ATTACKER, email, DEMO_PASSWORD, { 'X-Forwarded-For': '198.51.100.200' })).status).toBe(429);
    const locks = (await admin.get('/api/admin/sign-in-locks')).body.items as { address: string; email: string | null }[];
    expect([...new Set(locks.map((l) => l.address))]).toEqual([ATTACKER]);
  });

  it('believes X-Forwarded-For only from the proxies TRUST_PROXY names', async () => {
    const saved = process.env.TRUST_PROXY;
    process.env.TRUST_PROXY = 'loopback';
    resetEnvCache();
    const proxied = createApp();
    const behind = await serveOnLoopback(proxied.app);
    try {
      const email = demoEmail('checker');
      for (let i = 0; i < PER_NAME.free; i++) await behind.post('127.0.0.1', '/api/auth/login', { email, password: 'wrong-password' }, { 'X-Forwarded-For': '203.0.113.7' });
      // 203.0.113.7 is locked for this name; another client behind the same proxy is not.
      expect((await behind.post('127.0.0.1', '/api/auth/login', { email, password: DEMO_PASSWORD }, { 'X-Forwarded-For': '203.0.113.7' })).status).toBe(429);
      expect((await behind.post('127.0.0.1', '/api/auth/login', { email, password: DEMO_PASSWORD }, { 'X-Forwarded-For': '203.0.113.8' })).status).toBe(200);
      const locks = (await admin.get('/api/admin/sign-in-locks')).body.items as { address: string }[];
      expect(locks.map((l) => l.address)).toContain('203.0.113.7');
    } finally {
      await behind.stop();
      await proxied.close();
      if (saved === undefined) delete process.env.TRUST_PROXY;
      else process.env.TRUST_PROXY = saved;
      resetEnvCache();
    }
  });
});

describe('an administrator clears a lock', () => {
  it('lists counters with their locks, clears one (audited), and the name can sign in again from there', async () => {
    const email = demoEmail('viewer');
    for (let i = 0; i < PER_NAME.free; i++) await login(ATTACKER, email, 'wrong-password');
    expect((await login(ATTACKER, email, DEMO_PASSWORD)).status).toBe(429);

    const list = await admin.get('/api/admin/sign-in-locks');
    expect(list.status).toBe(200);
    expect(list.headers['cache-control']).toBe('no-store');
    const byName = (list.body.items as { id: number; address: string; email: string | null; failures: number; lockedUntil: string | null }[]).find((l) => l.email === email)!;
    expect(byName).toMatchObject({ address: ATTACKER, failures: PER_NAME.free, lockedUntil: expect.any(String) });
    const acrossNames = (list.body.items as { email: string | null; failures: number; lockedUntil: string | null }[]).find((l) => l.email === null)!;
    expect(acrossNames).toMatchObject({ failures: PER_NAME.free, lockedUntil: null });

    const engineer = await signIn(handle.app, 'engineer');
    expect((await engineer.get('/api/admin/sign-in-locks')).status).toBe(403);
    expect((await engineer.delete(`/api/admin/sign-in-locks/${byName.id}`)).status).toBe(403);
    expect((await request(handle.app).delete(`/api/admin/sign-in-locks/${byName.id}`)).status).toBe(401);

    expect((await admin.delete(`/api/admin/sign-in-locks/${byName.id}`)).status).toBe(204);
    expect((await admin.delete(`/api/admin/sign-in-locks/${byName.id}`)).status).toBe(404);
    expect((await login(ATTACKER, email, DEMO_PASSWORD)).status).toBe(200);
    const audit = await admin.get('/api/admin/audit?entityType=user&limit=5');
    expect(audit.body.items[0]).toMatchObject({ action: 'clear-sign-in-lock', entityId: email, before: { address: ATTACKER, email } });
  });
});

describe('a deactivated account', () => {
  afterEach(async () => {
    await User.update({ active: true }, { where: { email: demoEmail('viewer') } });
  });

  it('is told it is deactivated, but only after the right password', async () => {
    await User.update({ active: false }, { where: { email: demoEmail('viewer') } });
    const right = await login(VICTIM, demoEmail('viewer'), DEMO_PASSWORD);
    expect(right.status).toBe(403);
    expect(right.body.error.code).toBe('account_deactivated');
    expect(right.body.error.message).toMatch(/deactivated/);
    expect(right.headers['set-cookie']).toBeUndefined();
    const wrong = await login(VICTIM, demoEmail('viewer'), 'not-the-password');
    const unknown = await login(VICTIM, 'nobody@harrow.example', 'not-the-password');
    expect(wrong.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.body.error.code).toBe('invalid_credentials');
  });
});

/**
 * Two app processes on one database, as any deployment with several workers or machines runs:
 * a change made through one takes effect on the other within a second (the change feed,
 * server/services/change-feed.ts), and a killed listening connection leaves no stale answer.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { resetDatabase } from '../../server/db/setup';
import { closeDatabase, sequelize } from '../../server/db/sequelize';
import { DEMO_PASSWORD } from '../../server/db/seeders/demo';
import { createAccount, draftBody, EXTRA_PASSWORD } from '../helpers/library';
import { demoEmail } from '../helpers/app';
import { sessionCookie, startServerProcess, within, type ServerProcess } from '../helpers/server-process';
import { Material, User } from '../../server/db/models';
import { DEMO_CHAMBER_PORT } from '../../shared/demo-load-cases';

let a: ServerProcess;
let b: ServerProcess;
let admin: string;

beforeAll(async () => {
  await resetDatabase();
  [a, b] = await Promise.all([startServerProcess(), startServerProcess()]);
  admin = await sessionCookie(a.url, demoEmail('admin'), DEMO_PASSWORD);
}, 90_000);
afterAll(async () => {
  await Promise.all([a?.stop(), b?.stop()]);
  await closeDatabase();
});

const me = (url: string, cookie: string) => request(url).get('/api/auth/me').set('Cookie', cookie);
const userId = async (email: string) => (await User.findOne({ where: { email } }))!.id;

/** A user of its own per test, signed in (one session), with B's caches warmed. */
async function warmUser(email: string, name: string, role: 'viewer' | 'engineer' | 'librarian') {
  await createAccount(email, name, role);
  const cookie = await sessionCookie(a.url, email, EXTRA_PASSWORD);
  // B reads the session and the account now, and keeps both in memory.
  for (let i = 0; i < 3; i++) expect((await me(b.url, cookie)).status).toBe(200);
  return { cookie, id: await userId(email) };
}

describe('two app processes on one database', () => {
  it('ends a deactivated account on the other process within 1 s', async () => {
    const u = await warmUser('mp.deactivate@harrow.example', 'Ysella Penrose', 'engineer');
    const res = await request(a.url).patch(`/api/admin/users/${u.id}`).set('Cookie', admin).send({ active: false });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const took = await within(1_000, async () => (await me(b.url, u.cookie)).status === 401);
    expect(took, b.output()).toBeLessThanOrEqual(1_000);
    expect((await request(b.url).post('/api/projects').set('Cookie', u.cookie).send({ name: 'After deactivation', description: '' })).status).toBe(401);
  });

  it('applies a demotion on the other process within 1 s', async () => {
    const u = await warmUser('mp.demote@harrow.example', 'Jory Trethewey', 'librarian');
    expect((await me(b.url, u.cookie)).body.user.role).toBe('librarian');
    expect((await request(a.url).patch(`/api/admin/users/${u.id}`).set('Cookie', admin).send({ role: 'viewer' })).status).toBe(200);
    const took = await within(1_000, async () => (await me(b.url, u.cookie)).body.user?.role === 'viewer');
    expect(took).toBeLessThanOrEqual(1_000);
    // And the rights go with the role: the library desk refuses the demoted account on B.
    expect((await request(b.url).get('/api/library/sets?scope=mine').set('Cookie', u.cookie)).status).toBe(403);
  });

  it('ends the other sessions of a changed password on the other process within 1 s', async () => {
    const u = await warmUser('mp.password@harrow.example', 'Kerensa Polglase', 'viewer');
    const second = await sessionCookie(a.url, 'mp.password@harrow.example', EXTRA_PASSWORD);
    expect((await me(b.url, second)).status).toBe(200);
    const res = await request(a.url).post('/api/auth/password').set('Cookie', u.cookie).send({ currentPassword: EXTRA_PASSWORD, newPassword: 'harrow-new-password-2026' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const took = await within(1_000, async () => (await me(b.url, second)).status === 401);
    expect(took).toBeLessThanOrEqual(1_000);
    // The session that changed it stays signed in, on both processes.
    expect((await me(b.url, u.cookie)).status).toBe(200);
  });

  it('ends a signed-out session on the other process at once', async () => {
    const u = await warmUser('mp.signout@harrow.example', 'Morwenna Pascoe', 'viewer');
    expect((await request(a.url).post('/api/auth/logout').set('Cookie', u.cookie)).status).toBeLessThan(300);
    const took = await within(1_000, async () => (await me(b.url, u.cookie)).status === 401);
    expect(took).toBeLessThanOrEqual(1_000);
  });

  /** Publishes a new Harrow Sound test set through A (drafted by one librarian, approved by another). */
  async function publishThroughA(condition: string): Promise<number> {
    const librarian = await sessionCookie(a.url, demoEmail('librarian'), DEMO_PASSWORD);
    const email = `mp.reviewer.${Date.now()}@harrow.example`;
    await createAccount(email, 'Tegen Rowe', 'librarian');
    const reviewer = await sessionCookie(a.url, email, EXTRA_PASSWORD);
    const acrylic = await Material.findOne({ where: { name: 'Cast acrylic (PMMA)' } });
    const draft = await request(a.url).post('/api/library/sets').set('Cookie', librarian).send(draftBody(acrylic!.id, { condition }));
    expect(draft.status, JSON.stringify(draft.body)).toBe(201);
    const submitted = await request(a.url).post(`/api/library/sets/${draft.body.id}/submit`).set('Cookie', librarian).send({ lockVersion: draft.body.lockVersion });
    expect(submitted.status, JSON.stringify(submitted.body)).toBe(200);
    const approved = await request(a.url).post(`/api/library/sets/${draft.body.id}/approve`).set('Cookie', reviewer).send({ lockVersion: submitted.body.lockVersion });
    expect(approved.status, JSON.stringify(approved.body) + JSON.stringify(submitted.body) + a.output().slice(-3000)).toBe(200);
    return draft.body.id as number;
  }

  const evaluateOn = async (url: string, cookie: string) => {
    const res = await request(url)
      .post('/api/evaluate')
      .set('Cookie', cookie)
      .send({ loadCase: DEMO_CHAMBER_PORT, filters: { transparent: true }, form: 'full' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    return (res.body.results as { propertySetId: number }[]).map((r) => r.propertySetId);
  };

  it('evaluates a newly published set on the other process within 1 s', async () => {
    const engineer = await sessionCookie(b.url, demoEmail('engineer'), DEMO_PASSWORD);
    const before = await evaluateOn(b.url, engineer);
    await evaluateOn(b.url, engineer); // cached now
    const id = await publishThroughA('Harrow Sound lot 14 cast sheet, change-feed check');
    expect(before).not.toContain(id);
    const took = await within(1_000, async () => (await evaluateOn(b.url, engineer)).includes(id));
    expect(took).toBeLessThanOrEqual(1_000);
  });

  it('runs WEB_CONCURRENCY workers on one port, each listening for changes, and stops them all gracefully', async () => {
    const several = await startServerProcess({ WEB_CONCURRENCY: '2' });
    try {
      const lines = several.output().match(/worker \d+ serving on http:\/\/localhost:(\d+)/g) ?? [];
      expect(lines).toHaveLength(2);
      expect(new Set(lines.map((l) => l.replace(/^worker \d+ /, '')))).toHaveProperty('size', 1);
      // Both workers answer on the shared port: requests carry the worker's process in no header,
      // so count the distinct listening connections instead (one per worker).
      const [r] = (await sequelize().query("SELECT count(*)::int AS n FROM pg_stat_activity WHERE application_name LIKE 'isobath-change-feed:%'")) as [{ n: number }[], unknown];
      expect(r[0].n).toBeGreaterThanOrEqual(4); // a, b and the two workers
      expect((await request(several.url).get('/api/health')).status).toBe(200);
    } finally {
      const exited = new Promise<number | null>((resolve) => several.child.once('exit', (code) => resolve(code)));
      several.child.kill('SIGTERM');
      expect(await exited).toBe(0);
    }
    expect(several.output()).toMatch(/SIGTERM: stopping 2 workers/);
  });

  it('serves no stale answer after its listening connection is killed, and listens again', async () => {
    const engineer = await sessionCookie(b.url, demoEmail('engineer'), DEMO_PASSWORD);
    await evaluateOn(b.url, engineer);
    await evaluateOn(b.url, engineer);
    const [rows] = (await sequelize().query('SELECT pg_terminate_backend(pid) AS killed FROM pg_stat_activity WHERE application_name = :name', {
      replacements: { name: `isobath-change-feed:${b.child.pid}` },
    })) as [{ killed: boolean }[], unknown];
    expect(rows).toEqual([{ killed: true }]);
    const id = await publishThroughA('Harrow Sound lot 15 cast sheet, lost-listener check');
    const took = await within(1_000, async () => (await evaluateOn(b.url, engineer)).includes(id));
    expect(took).toBeLessThanOrEqual(1_000);
    // It reconnects by itself: a new listening connection of B's shows up.
    const back = await within(10_000, async () => {
      const [r] = (await sequelize().query('SELECT count(*)::int AS n FROM pg_stat_activity WHERE application_name = :name', { replacements: { name: `isobath-change-feed:${b.child.pid}` } })) as [{ n: number }[], unknown];
      return r[0].n === 1;
    });
    expect(back).toBeLessThan(10_000);
  });
});

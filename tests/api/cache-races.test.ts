/**
 * Caches dropped after the commit, never before: requests race a demotion, a deactivation and a
 * password reset, and no request that starts after the change's answer is served with the old
 * rights (each change is applied after its transaction commits; a read that began before a
 * change is not kept by the caches).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestApp, signIn, type Agent } from '../helpers/app';
import { createAccount, signInAs } from '../helpers/library';
import { listCaughtMail } from '../../server/services/mail';

let handle: Awaited<ReturnType<typeof startTestApp>>;
let admin: Agent;

beforeAll(async () => {
  handle = await startTestApp();
  admin = await signIn(handle.app, 'admin');
});
afterAll(async () => {
  await handle.stop();
});

interface Sample {
  started: number;
  status: number;
  role?: string;
}

/**
 * Runs `workers` loops of `probe` until `change` has answered and `after` ms more have passed;
 * returns the change's answer time and every sample with its start time.
 */
async function race(workers: number, probe: () => Promise<Omit<Sample, 'started'>>, change: () => Promise<void>, after = 400) {
  const samples: Sample[] = [];
  let stopAt = Number.POSITIVE_INFINITY;
  const loop = async () => {
    while (performance.now() < stopAt) {
      const started = performance.now();
      samples.push({ started, ...(await probe()) });
    }
  };
  const loops = Array.from({ length: workers }, loop);
  await new Promise((r) => setTimeout(r, 60));
  await change();
  const answered = performance.now();
  stopAt = answered + after;
  await Promise.all(loops);
  return { answered, before: samples.filter((s) => s.started < answered), afterwards: samples.filter((s) => s.started > answered) };
}

async function tokenMailedTo(email: string, path: string): Promise<string> {
  for (let i = 0; i < 100; i++) {
    const mail = (await listCaughtMail({ limit: 100 })).find((m) => m.to.includes(email) && m.text.includes(path));
    if (mail) return mail.text.match(new RegExp(`${path}\\?token=([A-Za-z0-9_-]+)`))![1];
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`no message to ${email} with ${path}`);
}

describe('caches under racing requests', () => {
  it('serves no request with admin rights once the demotion has answered', async () => {
    const u = await createAccount('race.admin@harrow.example', 'Senara Nance', 'admin');
    const agent = await signInAs(handle.app, 'race.admin@harrow.example');
    const { before, afterwards } = await race(
      12,
      async () => {
        const r = await agent.get('/api/auth/me');
        return { status: r.status, role: r.body.user?.role };
      },
      async () => {
        expect((await admin.patch(`/api/admin/users/${u.id}`).send({ role: 'viewer' })).status).toBe(200);
      },
    );
    expect(before.some((s) => s.role === 'admin')).toBe(true);
    expect(afterwards.length).toBeGreaterThan(10);
    expect(afterwards.filter((s) => s.role !== 'viewer')).toEqual([]);
    expect((await agent.post('/api/admin/invitations').send({ email: 'race.invite@harrow.example', role: 'admin' })).status).toBe(403);
  });

  it('refuses every request of a deactivated account once the deactivation has answered', async () => {
    const u = await createAccount('race.deactivated@harrow.example', 'Pedrek Angove', 'engineer');
    const agent = await signInAs(handle.app, 'race.deactivated@harrow.example');
    const { before, afterwards } = await race(
      12,
      async () => ({ status: (await agent.get('/api/projects')).status }),
      async () => {
        expect((await admin.patch(`/api/admin/users/${u.id}`).send({ active: false })).status).toBe(200);
      },
    );
    expect(before.some((s) => s.status === 200)).toBe(true);
    expect(afterwards.length).toBeGreaterThan(10);
    expect(afterwards.filter((s) => s.status !== 401)).toEqual([]);
  });

  it('ends every old session once the password reset has answered', async () => {
    await createAccount('race.reset@harrow.example', 'Wenna Curnow', 'engineer');
    const agent = await signInAs(handle.app, 'race.reset@harrow.example');
    await request(handle.app).post('/api/auth/password-reset/request').send({ email: 'race.reset@harrow.example' }).expect(202);
    const token = await tokenMailedTo('race.reset@harrow.example', '/reset-password');
    const { before, afterwards } = await race(
      12,
      async () => ({ status: (await agent.get('/api/projects')).status }),
      async () => {
        expect((await request(handle.app).post('/api/auth/password-reset').send({ token, password: 'harrow-race-reset-2026' })).status).toBe(200);
      },
    );
    expect(before.some((s) => s.status === 200)).toBe(true);
    expect(afterwards.length).toBeGreaterThan(10);
    expect(afterwards.filter((s) => s.status !== 401)).toEqual([]);
  });
});

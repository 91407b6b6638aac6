import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { startTestApp } from '../helpers/app';
import { createApp } from '../../server/app';
import { resetEnvCache } from '../../server/config/env';
import { DEMO_PASSWORD } from '../../server/db/seeders/demo';

let handle: Awaited<ReturnType<typeof startTestApp>>;
let writes: { method: 'post' | 'put' | 'patch' | 'delete'; path: string }[] = [];
beforeAll(async () => {
  handle = await startTestApp();
  const doc = (await request(handle.app).get('/api/openapi.json')).body as { paths: Record<string, Record<string, unknown>> };
  writes = Object.entries(doc.paths).flatMap(([path, ops]) =>
    Object.keys(ops)
      .filter((m) => m !== 'get')
      .map((method) => ({ method: method as 'post', path: path.replace(/\{[A-Za-z]+\}/g, '1') })),
  );
});
afterAll(async () => {
  await handle.stop();
});

const signInCookie = async (email: string) => {
  const res = await request(handle.app).post('/api/auth/login').send({ email, password: DEMO_PASSWORD });
  expect(res.status).toBe(200);
  return String(res.headers['set-cookie']).split(';')[0];
};

describe('cross-site request forgery', () => {
  it('refuses every state-changing operation sent from another origin, even with a valid session', async () => {
    const cookie = await signInCookie('admin@harrow.example');
    expect(writes.length).toBeGreaterThan(30);
    for (const w of writes) {
      const byOrigin = await request(handle.app)[w.method](w.path).set('Cookie', cookie).set('Origin', 'https://elsewhere.example').send({});
      expect(byOrigin.status, `${w.method} ${w.path}`).toBe(403);
      expect(byOrigin.body.error.code).toBe('cross_origin');
      const bySite = await request(handle.app)[w.method](w.path).set('Cookie', cookie).set('Sec-Fetch-Site', 'cross-site').send({});
      expect(bySite.status, `${w.method} ${w.path}`).toBe(403);
    }
  });

  it('refuses form-encoded and plain-text bodies, which a cross-site form could send', async () => {
    const cookie = await signInCookie('engineer@harrow.example');
    expect((await request(handle.app).post('/api/projects').set('Cookie', cookie).type('form').send({ name: 'x' })).status).toBe(415);
    expect((await request(handle.app).post('/api/projects').set('Cookie', cookie).set('Content-Type', 'text/plain').send('{"name":"x"}')).status).toBe(415);
  });

  it('lets a same-origin page and a script without Origin write with a JSON body', async () => {
    const cookie = await signInCookie('engineer@harrow.example');
    const server = createServer(handle.app);
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    try {
      const same = await request(base).post('/api/projects').set('Cookie', cookie).set('Origin', base).set('Sec-Fetch-Site', 'same-origin').send({ name: 'HS-2 sonar dome' });
      expect(same.status).toBe(201);
    } finally {
      await new Promise<void>((resolve) => server.close(() => resolve()));
    }
    const script = await request(handle.app).post('/api/projects').set('Cookie', cookie).send({ name: 'HS-2 ballast sphere' });
    expect(script.status).toBe(201);
  });
});

describe('Cache-Control on API answers', () => {
  // Reproduces finding 7 of the account-safety assessment: signed-in JSON (caught mail with its
  // tokens, users, audit, records, /api/auth/me) came without Cache-Control.
  it('is no-store on every GET operation for a signed-in administrator, and on answers from the answer cache', async () => {
    const cookie = await signInCookie('admin@harrow.example');
    const doc = (await request(handle.app).get('/api/openapi.json')).body as { paths: Record<string, Record<string, unknown>> };
    const gets = Object.entries(doc.paths).filter(([, ops]) => 'get' in ops).map(([path]) => path.replace(/\{[A-Za-z]+\}/g, '1'));
    expect(gets.length).toBeGreaterThan(25);
    const ok: string[] = [];
    for (const path of gets) {
      const res = await request(handle.app).get(path).set('Cookie', cookie);
      expect(res.headers['cache-control'], path).toMatch(/(^|, )no-store/);
      if (res.status === 200) ok.push(path);
    }
    expect(ok).toEqual(expect.arrayContaining(['/api/auth/me', '/api/admin/users', '/api/admin/mail', '/api/admin/audit', '/api/admin/invitations', '/api/property-sets/1', '/api/projects']));
    const body = { loadCase: { pressure: { value: 0.5e6 }, temperature: { min: 15, max: 40 }, sustainedHours: 100, cycles: 100, component: { type: 'flat-disc', diameter: 0.25, thickness: 0.04, edge: 'clamped' } }, limit: 3 };
    for (let i = 0; i < 2; i++) {
      const res = await request(handle.app).post('/api/evaluate').set('Cookie', cookie).send(body);
      expect(res.status).toBe(200);
      expect(res.headers['cache-control']).toBe('no-store');
    }
  });
});

describe('production settings', () => {
  const saved = { ...process.env };
  afterAll(() => {
    process.env = saved;
    resetEnvCache();
  });

  it('sends Secure, HttpOnly, SameSite cookies and HSTS behind an HTTPS proxy that TRUST_PROXY names', async () => {
    process.env.NODE_ENV = 'production';
    process.env.SESSION_SECRET = 'a-production-secret-of-more-than-32-characters';
    process.env.APP_URL = 'https://isobath.harrow-sound.example';
    // The TLS-terminating proxy on this machine: its X-Forwarded-Proto is believed.
    process.env.TRUST_PROXY = 'loopback';
    resetEnvCache();
    const prod = createApp();
    try {
      const res = await request(prod.app).post('/api/auth/login').set('X-Forwarded-Proto', 'https').send({ email: 'viewer@harrow.example', password: DEMO_PASSWORD });
      expect(res.status).toBe(200);
      const cookie = String(res.headers['set-cookie']);
      expect(cookie).toMatch(/; Secure/i);
      expect(cookie).toMatch(/HttpOnly/i);
      expect(cookie).toMatch(/SameSite=Lax/i);
      expect(res.headers['strict-transport-security']).toMatch(/max-age=\d+/);
    } finally {
      await prod.close();
    }
  });

  it('ignores X-Forwarded-Proto from loopback when TRUST_PROXY is unset: no Secure cookie goes over plain HTTP', async () => {
    process.env.NODE_ENV = 'production';
    process.env.SESSION_SECRET = 'a-production-secret-of-more-than-32-characters';
    process.env.APP_URL = 'https://isobath.harrow-sound.example';
    delete process.env.TRUST_PROXY;
    resetEnvCache();
    const prod = createApp();
    try {
      const res = await request(prod.app).post('/api/auth/login').set('X-Forwarded-Proto', 'https').send({ email: 'viewer@harrow.example', password: DEMO_PASSWORD });
      expect(res.headers['set-cookie']).toBeUndefined();
    } finally {
      await prod.close();
    }
  });
});

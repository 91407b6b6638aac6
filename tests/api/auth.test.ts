import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestApp, signIn, demoEmail } from '../helpers/app';
import { DEMO_PASSWORD } from '../../server/db/seeders/demo';
import { User } from '../../server/db/models';
import { ROLES } from '../../shared/schemas/auth';

let handle: Awaited<ReturnType<typeof startTestApp>>;
beforeAll(async () => {
  handle = await startTestApp();
});
afterAll(async () => {
  await handle.stop();
});

describe('POST /api/auth/login', () => {
  it.each(ROLES)('signs in the demo %s and returns the role with its permissions', async (role) => {
    const res = await request(handle.app).post('/api/auth/login').send({ email: demoEmail(role), password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email: demoEmail(role), role });
    expect(res.body.user.permissions).toContain('catalogue:read');
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/isobath\.sid=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
  });

  it('accepts the e-mail in any case and with spaces around it', async () => {
    const res = await request(handle.app).post('/api/auth/login').send({ email: '  Engineer@Harrow.Example ', password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
  });

  it('returns 401 with one message for a wrong password and for an unknown account', async () => {
    const wrong = await request(handle.app).post('/api/auth/login').send({ email: demoEmail('engineer'), password: 'not-it' });
    const unknown = await request(handle.app).post('/api/auth/login').send({ email: 'nobody@harrow.example', password: 'not-it' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.headers['set-cookie']).toBeUndefined();
  });

  it('returns 400 with field errors for a malformed body', async () => {
    const res = await request(handle.app).post('/api/auth/login').send({ email: 'not-an-email', password: '' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'password']);
  });

  it('returns 400 for invalid JSON and 415 for a form-encoded body', async () => {
    const bad = await request(handle.app).post('/api/auth/login').set('content-type', 'application/json').send('{"email":');
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('invalid_json');
    const form = await request(handle.app).post('/api/auth/login').type('form').send({ email: demoEmail('engineer'), password: DEMO_PASSWORD });
    expect(form.status).toBe(415);
  });

  it('refuses a sign-in posted from another origin', async () => {
    const res = await request(handle.app)
      .post('/api/auth/login')
      .set('Origin', 'https://elsewhere.example')
      .send({ email: demoEmail('engineer'), password: DEMO_PASSWORD });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('cross_origin');
  });

  it('issues a new session id at sign-in (a planted id is not kept)', async () => {
    const agent = request.agent(handle.app);
    await agent.post('/api/auth/login').send({ email: demoEmail('viewer'), password: 'wrong' });
    const first = await agent.post('/api/auth/login').send({ email: demoEmail('viewer'), password: DEMO_PASSWORD });
    const second = await agent.post('/api/auth/login').send({ email: demoEmail('viewer'), password: DEMO_PASSWORD });
    const sid = (r: request.Response) => String(r.headers['set-cookie']).match(/isobath\.sid=([^;]+)/)?.[1];
    expect(sid(first)).toBeTruthy();
    expect(sid(second)).toBeTruthy();
    expect(sid(second)).not.toBe(sid(first));
  });
});

describe('GET /api/auth/me and POST /api/auth/logout', () => {
  it('returns 401 without a session', async () => {
    const res = await request(handle.app).get('/api/auth/me');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('returns the signed-in user, and 401 after sign-out', async () => {
    const agent = await signIn(handle.app, 'checker');
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.role).toBe('checker');
    expect(me.body.user.permissions).toContain('shortlist:check');
    expect((await agent.post('/api/auth/logout')).status).toBe(204);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
  });

  it('ends the session of a deactivated account at its next request', async () => {
    const agent = await signIn(handle.app, 'viewer');
    expect((await agent.get('/api/auth/me')).status).toBe(200);
    await User.update({ active: false }, { where: { email: demoEmail('viewer') } });
    expect((await agent.get('/api/auth/me')).status).toBe(401);
    const again = await request(handle.app).post('/api/auth/login').send({ email: demoEmail('viewer'), password: DEMO_PASSWORD });
    expect(again.status).toBe(403);
    expect(again.body.error.code).toBe('account_deactivated');
    await User.update({ active: true }, { where: { email: demoEmail('viewer') } });
  });

  it('stores the password as a bcrypt hash, never in clear', async () => {
    const user = await User.findOne({ where: { email: demoEmail('engineer') } });
    expect(user?.passwordHash).toMatch(/^\$2[aby]\$\d\d\$/);
    expect(user?.passwordHash).not.toContain(DEMO_PASSWORD);
  });
});

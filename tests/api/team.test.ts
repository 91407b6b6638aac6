import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestApp, signIn, type Agent } from '../helpers/app';
import { listCaughtMail } from '../../server/services/mail';
import { Invitation } from '../../server/db/models/projects';
import { User } from '../../server/db/models';
import { DEMO_PASSWORD } from '../../server/db/seeders/demo';
import { createAccount, signInAs } from '../helpers/library';
import { settleOutbox } from '../../server/services/outbox';
import { sequelize } from '../../server/db/sequelize';

let handle: Awaited<ReturnType<typeof startTestApp>>;
let admin: Agent;
beforeAll(async () => {
  handle = await startTestApp();
  admin = await signIn(handle.app, 'admin');
});
afterAll(async () => {
  await handle.stop();
});

/**
 * The one-time link's token from the newest message to an address, waiting up to 5 s for it
 * (a reset link is mailed after the answer). `not` skips tokens already seen.
 */
async function tokenMailedTo(email: string, path: string, not: string[] = []): Promise<string> {
  const deadline = Date.now() + 5_000;
  for (;;) {
    const tokens = (await listCaughtMail({ limit: 100 }))
      .filter((m) => m.to.includes(email) && m.text.includes(path))
      .map((m) => m.text.match(new RegExp(`${path}\\?token=([A-Za-z0-9_-]+)`))![1])
      .filter((t) => !not.includes(t));
    if (tokens.length) return tokens[0];
    if (Date.now() > deadline) throw new Error(`no message to ${email} with ${path}`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

describe('invitations', () => {
  it('lets only admins invite; the link creates the account once and signs the person in', async () => {
    const engineer = await signIn(handle.app, 'engineer');
    expect((await engineer.post('/api/admin/invitations').send({ email: 'new.hand@harrow.example', role: 'engineer' })).status).toBe(403);
    const invited = await admin.post('/api/admin/invitations').send({ email: 'New.Hand@harrow.example', role: 'checker' });
    expect(invited.status).toBe(201);
    const token = await tokenMailedTo('new.hand@harrow.example', '/welcome');

    const agent = request.agent(handle.app);
    const accepted = await agent.post('/api/auth/invitations/accept').send({ token, name: 'Oona Ferrie', password: 'a-long-passphrase-1' });
    expect(accepted.status).toBe(201);
    expect(accepted.body.user).toMatchObject({ email: 'new.hand@harrow.example', role: 'checker' });
    expect((await agent.get('/api/auth/me')).body.user.name).toBe('Oona Ferrie');

    const again = await request(handle.app).post('/api/auth/invitations/accept').send({ token, name: 'Someone Else', password: 'a-long-passphrase-2' });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('invalid_token');
  });

  it('refuses an expired invitation and a short password', async () => {
    await admin.post('/api/admin/invitations').send({ email: 'late.comer@harrow.example', role: 'viewer' }).expect(201);
    const token = await tokenMailedTo('late.comer@harrow.example', '/welcome');
    const short = await request(handle.app).post('/api/auth/invitations/accept').send({ token, name: 'Late Comer', password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields).toHaveProperty('password');
    await Invitation.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { email: 'late.comer@harrow.example' } });
    const expired = await request(handle.app).post('/api/auth/invitations/accept').send({ token, name: 'Late Comer', password: 'a-long-passphrase-3' });
    expect(expired.status).toBe(400);
    expect(await User.count({ where: { email: 'late.comer@harrow.example' } })).toBe(0);
  });

  // Reproduces finding 7 of the account-safety assessment: invitations could not be revoked, and two
  // live ones for one address raced for the role.
  it('replaces a live invitation to the same address: only the newest link works', async () => {
    const first = await admin.post('/api/admin/invitations').send({ email: 'twice.asked@harrow.example', role: 'admin' });
    expect(first.body).toMatchObject({ mail: 'sent', replaced: 0 });
    const oldToken = await tokenMailedTo('twice.asked@harrow.example', '/welcome');
    const second = await admin.post('/api/admin/invitations').send({ email: 'twice.asked@harrow.example', role: 'viewer' });
    expect(second.status).toBe(201);
    expect(second.body).toMatchObject({ replaced: 1, mail: 'sent' });
    const newToken = await tokenMailedTo('twice.asked@harrow.example', '/welcome', [oldToken]);
    const list = (await admin.get('/api/admin/invitations')).body.items as { id: number; state: string; mail: { status: string } | null }[];
    expect(list.find((i) => i.id === first.body.id)).toMatchObject({ state: 'revoked', mail: { status: 'sent' } });
    expect(list.find((i) => i.id === second.body.id)).toMatchObject({ state: 'waiting', mail: { status: 'sent' } });
    expect((await request(handle.app).post('/api/auth/invitations/accept').send({ token: oldToken, name: 'Tam Sinclair', password: 'a-long-passphrase-4' })).status).toBe(400);
    const accepted = await request(handle.app).post('/api/auth/invitations/accept').send({ token: newToken, name: 'Tam Sinclair', password: 'a-long-passphrase-4' });
    expect(accepted.status).toBe(201);
    expect(accepted.body.user.role).toBe('viewer');
  });

  it('keeps one live invitation when several are sent to one address at once', async () => {
    const answers = await Promise.all(Array.from({ length: 5 }, (_, i) => admin.post('/api/admin/invitations').send({ email: 'rushed@harrow.example', role: i % 2 ? 'engineer' : 'viewer' })));
    expect(answers.map((r) => r.status)).toEqual([201, 201, 201, 201, 201]);
    const live = await Invitation.count({ where: { email: 'rushed@harrow.example', usedAt: null, revokedAt: null } });
    expect(live).toBe(1);
  });

  it('revokes an invitation (its link stops working) and refuses to revoke it twice or revoke an accepted one', async () => {
    const inv = await admin.post('/api/admin/invitations').send({ email: 'changed.mind@harrow.example', role: 'engineer' });
    const token = await tokenMailedTo('changed.mind@harrow.example', '/welcome');
    const engineer = await signIn(handle.app, 'engineer');
    expect((await engineer.post(`/api/admin/invitations/${inv.body.id}/revoke`)).status).toBe(403);
    const revoked = await admin.post(`/api/admin/invitations/${inv.body.id}/revoke`);
    expect(revoked.status).toBe(200);
    expect(revoked.body).toMatchObject({ id: inv.body.id, state: 'revoked', revokedAt: expect.any(String) });
    expect((await request(handle.app).post('/api/auth/invitations/accept').send({ token, name: 'Rhona Flett', password: 'a-long-passphrase-5' })).body.error.code).toBe('invalid_token');
    expect((await admin.post(`/api/admin/invitations/${inv.body.id}/revoke`)).status).toBe(409);
    expect((await admin.post(`/api/admin/invitations/${inv.body.id}/resend`)).status).toBe(409);
    expect((await admin.post('/api/admin/invitations/999999/revoke')).status).toBe(404);
    const audit = (await admin.get('/api/admin/audit?entityType=user&limit=5')).body.items as { action: string; entityId: string }[];
    expect(audit[0]).toMatchObject({ action: 'revoke-invitation', entityId: 'changed.mind@harrow.example' });
  });

  it('resends an invitation with a new link and expiry; the old link stops working', async () => {
    const inv = await admin.post('/api/admin/invitations').send({ email: 'lost.the.mail@harrow.example', role: 'checker' });
    const oldToken = await tokenMailedTo('lost.the.mail@harrow.example', '/welcome');
    await Invitation.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { id: inv.body.id } });
    const resent = await admin.post(`/api/admin/invitations/${inv.body.id}/resend`);
    expect(resent.status).toBe(200);
    expect(resent.body).toMatchObject({ id: inv.body.id, mail: 'sent' });
    expect(new Date(resent.body.expiresAt).getTime()).toBeGreaterThan(Date.now() + 71 * 3600_000);
    const newToken = await tokenMailedTo('lost.the.mail@harrow.example', '/welcome', [oldToken]);
    expect((await request(handle.app).post('/api/auth/invitations/accept').send({ token: oldToken, name: 'Euan Isbister', password: 'a-long-passphrase-6' })).status).toBe(400);
    const accepted = await request(handle.app).post('/api/auth/invitations/accept').send({ token: newToken, name: 'Euan Isbister', password: 'a-long-passphrase-6' });
    expect(accepted.status).toBe(201);
    expect(accepted.body.user.role).toBe('checker');
    expect((await admin.post(`/api/admin/invitations/${inv.body.id}/resend`)).status).toBe(409);
  });

  it('refuses to invite an address that already has an account', async () => {
    const res = await admin.post('/api/admin/invitations').send({ email: 'viewer@harrow.example', role: 'viewer' });
    expect(res.status).toBe(409);
  });
});

describe('roles and deactivation', () => {
  it('changes a role, taking effect at the next request', async () => {
    const viewer = await signIn(handle.app, 'viewer');
    expect((await viewer.post('/api/projects').send({ name: 'x' })).status).toBe(403);
    const id = (await User.findOne({ where: { email: 'viewer@harrow.example' } }))!.id;
    expect((await admin.patch(`/api/admin/users/${id}`).send({ role: 'engineer' })).status).toBe(200);
    expect((await viewer.post('/api/projects').send({ name: 'Promoted' })).status).toBe(201);
    await admin.patch(`/api/admin/users/${id}`).send({ role: 'viewer' }).expect(200);
  });

  it("ends a deactivated account's sessions at once and refuses its sign-in", async () => {
    const checker = await signIn(handle.app, 'checker');
    const id = (await User.findOne({ where: { email: 'checker@harrow.example' } }))!.id;
    expect((await admin.patch(`/api/admin/users/${id}`).send({ active: false })).status).toBe(200);
    expect((await checker.get('/api/auth/me')).status).toBe(401);
    const refused = await request(handle.app).post('/api/auth/login').send({ email: 'checker@harrow.example', password: DEMO_PASSWORD });
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('account_deactivated');
    await admin.patch(`/api/admin/users/${id}`).send({ active: true }).expect(200);
  });

  it('will not let an admin deactivate themselves', async () => {
    const id = (await User.findOne({ where: { email: 'admin@harrow.example' } }))!.id;
    expect((await admin.patch(`/api/admin/users/${id}`).send({ active: false })).status).toBe(409);
  });

  // Reproduces finding 7 of the account-safety assessment: two admins demoting each other at once
  // left no active administrator.
  it.each([
    ['demoting', { role: 'viewer' }],
    ['deactivating', { active: false }],
  ])('keeps one active administrator when two admins are %s each other at once (409 "last_admin" for one)', async (_what, change) => {
    const first = (await User.findOne({ where: { email: 'admin@harrow.example' } }))!;
    const second = await createAccount(`second.admin.${Object.keys(change)[0]}@harrow.example`, 'Isla Rendall', 'admin');
    const outcomes: string[] = [];
    for (let round = 0; round < 6; round++) {
      const [a, b] = await Promise.all([signInAs(handle.app, first.email, DEMO_PASSWORD), signInAs(handle.app, second.email)]);
      const answers = await Promise.all([a.patch(`/api/admin/users/${second.id}`).send(change), b.patch(`/api/admin/users/${first.id}`).send(change)]);
      const statuses = answers.map((r) => r.status);
      outcomes.push(statuses.join('/'));
      // One change goes through. The other is refused as the last administrator's (409) — or, when
      // the first had already committed before the second was authorised, as no longer an admin's (403).
      expect(statuses.filter((s) => s === 200), `round ${round}: ${statuses}`).toHaveLength(1);
      const refused = answers.find((r) => r.status !== 200)!;
      expect([409, 403]).toContain(refused.status);
      if (refused.status === 409) expect(refused.body.error.code).toBe('last_admin');
      const admins = await User.findAll({ where: { role: 'admin', active: true } });
      expect(admins).toHaveLength(1);
      // The one left restores the other for the next round.
      const winner = answers[0].status === 200 ? a : b;
      const loser = answers[0].status === 200 ? second : first;
      await winner.patch(`/api/admin/users/${loser.id}`).send({ role: 'admin', active: true }).expect(200);
    }
    expect(await User.count({ where: { role: 'admin', active: true } }), outcomes.join(', ')).toBe(2);
    const again = await signInAs(handle.app, first.email, DEMO_PASSWORD);
    await again.patch(`/api/admin/users/${second.id}`).send({ role: 'viewer', active: false }).expect(200);
    admin = again;
  });
});

describe('passwords', () => {
  it('answers a reset request the same way whether or not the address has an account', async () => {
    const known = await request(handle.app).post('/api/auth/password-reset/request').send({ email: 'librarian@harrow.example' });
    const unknown = await request(handle.app).post('/api/auth/password-reset/request').send({ email: 'nobody@harrow.example' });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(known.body).toEqual(unknown.body);
    await tokenMailedTo('librarian@harrow.example', '/reset-password');
    await settleOutbox();
    expect((await listCaughtMail({ limit: 100 })).some((m) => m.to.includes('nobody@harrow.example'))).toBe(false);
    // The job for the unknown address is gone, and nothing about it is left to show.
    const [left] = await sequelize().query(`SELECT count(*)::int AS n FROM mail_outbox WHERE recipients ? 'nobody@harrow.example'`);
    expect((left as { n: number }[])[0].n).toBe(0);
  });

  it('resets a password by the mailed link once, ending old sessions', async () => {
    const old = await signIn(handle.app, 'librarian');
    await request(handle.app).post('/api/auth/password-reset/request').send({ email: 'librarian@harrow.example' }).expect(202);
    const token = await tokenMailedTo('librarian@harrow.example', '/reset-password');
    const reset = await request(handle.app).post('/api/auth/password-reset').send({ token, password: 'tidal-gauge-librarian' });
    expect(reset.status).toBe(200);
    expect((await old.get('/api/auth/me')).status).toBe(401);
    expect((await request(handle.app).post('/api/auth/password-reset').send({ token, password: 'another-long-one-9' })).status).toBe(400);
    expect((await request(handle.app).post('/api/auth/login').send({ email: 'librarian@harrow.example', password: 'tidal-gauge-librarian' })).status).toBe(200);
  });

  it('changes the own password after checking the current one', async () => {
    const engineer = await signIn(handle.app, 'engineer');
    const wrong = await engineer.post('/api/auth/password').send({ currentPassword: 'not-it', newPassword: 'sounding-line-2026' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toHaveProperty('currentPassword');
    expect((await engineer.post('/api/auth/password').send({ currentPassword: DEMO_PASSWORD, newPassword: 'sounding-line-2026' })).status).toBe(200);
    expect((await engineer.get('/api/auth/me')).status).toBe(200);
    expect((await request(handle.app).post('/api/auth/login').send({ email: 'engineer@harrow.example', password: 'sounding-line-2026' })).status).toBe(200);
    expect((await request(handle.app).post('/api/auth/password').send({ currentPassword: 'x', newPassword: 'y'.repeat(12) })).status).toBe(401);
  });
});

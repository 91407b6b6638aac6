// Names that go into mail headers are one line. Reproduces finding 7 of the account-safety
// assessment: a newline in a shortlist's name silently stopped the checkers' mail. Every such field
// now refuses control characters with a 400 that names the field, and nothing is written.
import { createHash, randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestApp, signIn, type Agent } from '../helpers/app';
import { draftBody } from '../helpers/library';
import { AuditEntry, User } from '../../server/db/models';
import { Invitation } from '../../server/db/models/projects';
import { ONE_LINE_MESSAGE } from '../../shared/schemas/text';

let handle: Awaited<ReturnType<typeof startTestApp>>;
let engineer: Agent;
let librarian: Agent;
let projectId: number;
let loadCaseId: number;
let materialId: number;
beforeAll(async () => {
  handle = await startTestApp();
  engineer = await signIn(handle.app, 'engineer');
  librarian = await signIn(handle.app, 'librarian');
  projectId = (await engineer.post('/api/projects').send({ name: 'HS-2 forward viewport' })).body.id;
  const lc = await engineer.post(`/api/projects/${projectId}/load-cases`).send({
    name: 'Forward port, 1,200 m',
    loadCase: { pressure: { depth: 1200, latitude: 57, water: 'sea' }, temperature: { min: 2, max: 25 }, sustainedHours: 1000, cycles: 1000, component: { type: 'flat-disc', diameter: 0.2, thickness: 0.05, edge: 'clamped' } },
  });
  loadCaseId = lc.body.id;
  materialId = (await librarian.get('/api/materials')).body.items[0].id;
});
afterAll(async () => {
  await handle.stop();
});

// Each is a header injection attempt or a character a mail server refuses in a header.
const BAD = ['Port window\nBcc: everyone@harrow.example', 'Port window\r\nX-Priority: 1', 'Port\twindow', 'Port\u0085window', 'Port\u2028window', 'Port\u007fwindow'];

describe('one-line names', () => {
  it.each(BAD.map((v) => [JSON.stringify(v), v]))('refuses the shortlist name %s with 400 naming "name", and creates nothing', async (_label, bad) => {
    const audits = await AuditEntry.count();
    const res = await engineer.post(`/api/projects/${projectId}/shortlists`).send({ loadCaseId, name: bad });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ name: ONE_LINE_MESSAGE });
    expect(await AuditEntry.count()).toBe(audits);
  });

  it('refuses a line break in project, load case, material, condition and reference names, naming each field', async () => {
    const bad = 'Harrow\nSound';
    const cases: [string, () => Promise<request.Response>, string][] = [
      ['project', () => engineer.post('/api/projects').send({ name: bad }), 'name'],
      ['project rename', () => engineer.patch(`/api/projects/${projectId}`).send({ name: bad, lockVersion: 0 }), 'name'],
      ['load case', () => engineer.post(`/api/projects/${projectId}/load-cases`).send({ name: bad, loadCase: { pressure: { value: 1e6 }, temperature: { min: 2, max: 25 }, sustainedHours: 1, cycles: 1, component: { type: 'flat-disc', diameter: 0.2, thickness: 0.05, edge: 'clamped' } } }), 'name'],
      ['material', () => librarian.post('/api/materials').send({ name: bad, family: 'acrylic', transparent: true }), 'name'],
      ['set condition', () => librarian.post('/api/library/sets').send(draftBody(materialId, { condition: bad })), 'condition'],
      ['reference title', () => librarian.post('/api/references').send({ kind: 'test-report', title: bad }), 'title'],
    ];
    for (const [what, send, field] of cases) {
      const res = await send();
      expect(res.status, what).toBe(400);
      expect(res.body.error.fields[field], what).toBe(ONE_LINE_MESSAGE);
    }
  });

  it("refuses a line break in a person's name when they accept an invitation, and creates no account", async () => {
    const token = randomBytes(32).toString('base64url');
    await Invitation.create({ email: 'new.diver@harrow.example', role: 'viewer', tokenHash: createHash('sha256').update(token).digest('hex'), expiresAt: new Date(Date.now() + 3600_000), usedAt: null, invitedById: null });
    const res = await request(handle.app).post('/api/auth/invitations/accept').send({ token, name: 'Ailsa\r\nBcc: crew@harrow.example', password: 'a-long-passphrase-8' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ name: ONE_LINE_MESSAGE });
    expect(await User.count({ where: { email: 'new.diver@harrow.example' } })).toBe(0);
  });

  it('still takes names with accents, dashes and other printable characters', async () => {
    const res = await engineer.post(`/api/projects/${projectId}/shortlists`).send({ loadCaseId, name: 'Forward port — cast, ø 200 mm, “lot 7”' });
    expect(res.status).toBe(201);
    expect(res.body.name).toBe('Forward port — cast, ø 200 mm, “lot 7”');
  });
});

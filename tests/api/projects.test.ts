import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestApp, signIn, type Agent } from '../helpers/app';
import { pdfText } from '../helpers/pdf-text';
import { listCaughtMail } from '../../server/services/mail';
import { PropertySet, User } from '../../server/db/models';
import { DesignRecord } from '../../server/db/models/projects';
import { hashPassword } from '../../server/auth/passwords';
import type { PropertySetDto } from '../../shared/schemas/catalogue';
import type { ShortlistDto } from '../../shared/schemas/projects';

let handle: Awaited<ReturnType<typeof startTestApp>>;
let engineer: Agent;
let checker: Agent;
let acrylic: PropertySetDto[];
beforeAll(async () => {
  handle = await startTestApp();
  engineer = await signIn(handle.app, 'engineer');
  checker = await signIn(handle.app, 'checker');
  acrylic = (await engineer.get('/api/property-sets?family=acrylic')).body.items;
});
afterAll(async () => {
  await handle.stop();
});

// Harrow Sound's 5 bar treatment chamber: a flat side viewport.
const chamberPort = {
  pressure: { value: 0.5e6 },
  temperature: { min: 15, max: 40 },
  sustainedHours: 5000,
  cycles: 10000,
  component: { type: 'flat-disc', diameter: 0.25, thickness: 0.04, edge: 'simply-supported' },
};

async function newProject(owner: Agent, name = 'TC-5 chamber viewports') {
  const res = await owner.post('/api/projects').send({ name, description: 'Harrow Sound treatment chamber' });
  expect(res.status).toBe(201);
  return res.body as { id: number };
}

async function userId(email: string) {
  return (await User.findOne({ where: { email } }))!.id;
}

/** A project with the checker as member, a load case and a shortlist of two acrylic sets. */
async function shortlistReady(): Promise<ShortlistDto> {
  // Earlier tests may retire sets: always shortlist what is published now.
  acrylic = (await engineer.get('/api/property-sets?family=acrylic')).body.items;
  const project = await newProject(engineer);
  await engineer.post(`/api/projects/${project.id}/members`).send({ userId: await userId('checker@harrow.example') }).expect(200);
  const lc = await engineer.post(`/api/projects/${project.id}/load-cases`).send({ name: 'Side port', loadCase: chamberPort });
  expect(lc.status).toBe(201);
  const sl = await engineer.post(`/api/projects/${project.id}/shortlists`).send({ loadCaseId: lc.body.id, name: 'Port material' });
  expect(sl.status).toBe(201);
  await engineer.post(`/api/shortlists/${sl.body.id}/items`).send({ propertySetId: acrylic[0].id, note: 'Standard minimums' }).expect(201);
  const last = await engineer.post(`/api/shortlists/${sl.body.id}/items`).send({ propertySetId: acrylic[1].id, note: 'Confirm lot data with the supplier' });
  expect(last.status).toBe(201);
  return last.body;
}

describe('projects and membership', () => {
  it('lets an engineer create a project and see it; a non-member gets 404, an admin sees it', async () => {
    const project = await newProject(engineer, 'Camera housing');
    expect((await engineer.get(`/api/projects/${project.id}`)).status).toBe(200);
    expect((await checker.get(`/api/projects/${project.id}`)).status).toBe(404);
    expect((await checker.get(`/api/projects/${project.id}/load-cases`)).status).toBe(404);
    const viewer = await signIn(handle.app, 'viewer');
    expect((await viewer.get(`/api/projects/${project.id}`)).status).toBe(404);
    expect((await viewer.get('/api/projects')).body.items.map((p: { id: number }) => p.id)).not.toContain(project.id);
    const admin = await signIn(handle.app, 'admin');
    expect((await admin.get(`/api/projects/${project.id}`)).status).toBe(200);
  });

  it('refuses project creation to viewers and librarians, and everything to anonymous callers', async () => {
    const viewer = await signIn(handle.app, 'viewer');
    expect((await viewer.post('/api/projects').send({ name: 'x' })).status).toBe(403);
    const librarian = await signIn(handle.app, 'librarian');
    expect((await librarian.post('/api/projects').send({ name: 'x' })).status).toBe(403);
    expect((await request(handle.app).get('/api/projects')).status).toBe(401);
  });

  it('lets only the owner (or an admin) add members; an added viewer can then read', async () => {
    const project = await newProject(engineer);
    const viewerId = await userId('viewer@harrow.example');
    await engineer.post(`/api/projects/${project.id}/members`).send({ userId: await userId('checker@harrow.example') }).expect(200);
    expect((await checker.post(`/api/projects/${project.id}/members`).send({ userId: viewerId })).status).toBe(403);
    const added = await engineer.post(`/api/projects/${project.id}/members`).send({ userId: viewerId });
    expect(added.body.members.map((m: { id: number }) => m.id)).toContain(viewerId);
    const viewer = await signIn(handle.app, 'viewer');
    expect((await viewer.get(`/api/projects/${project.id}`)).status).toBe(200);
    expect((await viewer.post(`/api/projects/${project.id}/load-cases`).send({ name: 'x', loadCase: chamberPort })).status).toBe(403);
  });

  it('returns 400 with field errors for a bad project or load case', async () => {
    const bad = await engineer.post('/api/projects').send({ name: '  ' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('name');
    const project = await newProject(engineer);
    const lc = await engineer.post(`/api/projects/${project.id}/load-cases`).send({ name: 'x', loadCase: { ...chamberPort, component: { ...chamberPort.component, thickness: -1 } } });
    expect(lc.status).toBe(400);
    expect(Object.keys(lc.body.error.fields)).toContain('loadCase.component.thickness');
  });
});

describe('shortlists and sign-off', () => {
  it('evaluates shortlisted candidates live against the load case', async () => {
    const sl = await shortlistReady();
    expect(sl.status).toBe('open');
    expect(sl.items).toHaveLength(2);
    expect(sl.items[0].note).toBe('Standard minimums');
    for (const item of sl.items) expect(['tension', 'compression', 'shear', 'buckling']).toContain(item.result?.governingMode);
    expect(sl.evaluation?.pressure).toBe(0.5e6);
  });

  it('reorders and edits notes, refuses unpublished sets and duplicates', async () => {
    const sl = await shortlistReady();
    const reordered = await engineer.post(`/api/shortlists/${sl.id}/reorder`).send({ lockVersion: sl.lockVersion, itemIds: [sl.items[1].id, sl.items[0].id] });
    expect(reordered.status).toBe(200);
    expect(reordered.body.items.map((i: { id: number }) => i.id)).toEqual([sl.items[1].id, sl.items[0].id]);
    const stale = await engineer.post(`/api/shortlists/${sl.id}/reorder`).send({ lockVersion: sl.lockVersion, itemIds: [sl.items[0].id, sl.items[1].id] });
    expect(stale.status).toBe(409);
    expect((await engineer.post(`/api/shortlists/${sl.id}/items`).send({ propertySetId: acrylic[0].id })).status).toBe(409);
    const draft = await PropertySet.create({ ...(await PropertySet.findByPk(acrylic[0].id))!.get({ plain: true }), id: undefined, status: 'draft', version: 9, lineageId: null, publishedAt: null, lockVersion: 0 } as never);
    const unpublished = await engineer.post(`/api/shortlists/${sl.id}/items`).send({ propertySetId: draft.id });
    expect(unpublished.status).toBe(400);
    expect(unpublished.body.error.fields).toHaveProperty('propertySetId');
    const noted = await engineer.patch(`/api/shortlists/${sl.id}/items/${sl.items[0].id}`).send({ note: 'Edge seal to confirm', lockVersion: sl.items[0].lockVersion });
    expect(noted.body.items.find((i: { id: number }) => i.id === sl.items[0].id).note).toBe('Edge seal to confirm');
  });

  // Reproduces finding 7 of the account-safety assessment: project edits and shortlist notes had
  // no version, so the last write won.
  it('refuses a note saved from an older read (409 stale) and keeps the newer note; of two at once, one wins', async () => {
    const sl = await shortlistReady();
    const item = sl.items[0];
    const first = await engineer.patch(`/api/shortlists/${sl.id}/items/${item.id}`).send({ note: 'Confirm the lot certificate', lockVersion: item.lockVersion });
    expect(first.status).toBe(200);
    const saved = first.body.items.find((i: { id: number }) => i.id === item.id);
    expect(saved.lockVersion).toBe(item.lockVersion + 1);
    const late = await engineer.patch(`/api/shortlists/${sl.id}/items/${item.id}`).send({ note: 'Written in another tab', lockVersion: item.lockVersion });
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('stale');
    expect((await engineer.get(`/api/shortlists/${sl.id}`)).body.items.find((i: { id: number }) => i.id === item.id).note).toBe('Confirm the lot certificate');
    expect((await engineer.patch(`/api/shortlists/${sl.id}/items/${item.id}`).send({ note: 'No version' })).status).toBe(400);

    const both = await Promise.all(
      ['Tab one: check the edge seal', 'Tab two: check the bearing surface'].map((note) => engineer.patch(`/api/shortlists/${sl.id}/items/${item.id}`).send({ note, lockVersion: saved.lockVersion })),
    );
    expect(both.map((r) => r.status).sort()).toEqual([200, 409]);
    const winner = both.find((r) => r.status === 200)!.body.items.find((i: { id: number }) => i.id === item.id).note;
    expect((await engineer.get(`/api/shortlists/${sl.id}`)).body.items.find((i: { id: number }) => i.id === item.id).note).toBe(winner);
  });

  it('refuses a project edit made from an older read (409 stale) and keeps the newer one; of two at once, one wins', async () => {
    const project = (await engineer.post('/api/projects').send({ name: 'HS-4 chamber viewports', description: 'Flat viewports, 5 bar' })).body;
    expect(project.lockVersion).toBe(0);
    const first = await engineer.patch(`/api/projects/${project.id}`).send({ lockVersion: 0, description: 'Flat viewports, 5 bar, treatment chamber' });
    expect(first.status).toBe(200);
    expect(first.body.lockVersion).toBe(1);
    const late = await engineer.patch(`/api/projects/${project.id}`).send({ lockVersion: 0, name: 'HS-4 renamed from an old tab' });
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('stale');
    const now = (await engineer.get(`/api/projects/${project.id}`)).body;
    expect(now).toMatchObject({ name: 'HS-4 chamber viewports', description: 'Flat viewports, 5 bar, treatment chamber', lockVersion: 1 });
    const missing = await engineer.patch(`/api/projects/${project.id}`).send({ name: 'No version' });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields).toHaveProperty('lockVersion');

    const both = await Promise.all(['HS-4 chamber ports (A)', 'HS-4 chamber ports (B)'].map((name) => engineer.patch(`/api/projects/${project.id}`).send({ lockVersion: 1, name })));
    expect(both.map((r) => r.status).sort()).toEqual([200, 409]);
    expect((await engineer.get(`/api/projects/${project.id}`)).body.name).toBe(both.find((r) => r.status === 200)!.body.name);
  });

  it('lists a submitted shortlist as waiting for the member checker (with the candidates below target) until it is checked', async () => {
    const sl = await shortlistReady();
    const waiting = async () => (await checker.get('/api/shortlists/awaiting-check').expect(200)).body.items as { id: number; itemCount: number; belowTarget: string[]; project: { id: number } }[];
    expect((await waiting()).some((w) => w.id === sl.id)).toBe(false);
    const s = await engineer.post(`/api/shortlists/${sl.id}/submit`).send({ lockVersion: sl.lockVersion }).expect(200);
    const mine = (await waiting()).find((w) => w.id === sl.id);
    expect(mine).toMatchObject({ itemCount: 2, project: { id: sl.projectId } });
    const expected = (s.body as ShortlistDto).items.filter((i) => i.result && i.result.margin < 0).map((i) => i.result!.name);
    expect(mine!.belowTarget).toEqual(expected);
    expect((await engineer.get(`/api/projects/${sl.projectId}`)).body.counts.awaitingCheck).toBe(1);
    // The author's own work never waits for them (an admin author is the case that could).
    expect((await engineer.get('/api/shortlists/awaiting-check')).status).toBe(403);
    await checker.post(`/api/shortlists/${sl.id}/check`).send({ lockVersion: s.body.lockVersion }).expect(200);
    expect((await waiting()).some((w) => w.id === sl.id)).toBe(false);
    expect((await engineer.get(`/api/projects/${sl.projectId}`)).body.counts).toMatchObject({ awaitingCheck: 0, checked: 1 });
  });

  it('never lets the author check their own shortlist, and only a checker who is a member', async () => {
    const sl = await shortlistReady();
    const submitted = await engineer.post(`/api/shortlists/${sl.id}/submit`).send({ lockVersion: sl.lockVersion });
    expect(submitted.status).toBe(200);
    expect(submitted.body.status).toBe('submitted');
    // The author is an engineer (no check permission): 403 from the role check.
    expect((await engineer.post(`/api/shortlists/${sl.id}/check`).send({ lockVersion: submitted.body.lockVersion })).status).toBe(403);
    // A checker who authored a shortlist cannot check it either.
    const project = sl.projectId;
    const own = await checker.post(`/api/projects/${project}/shortlists`).send({ loadCaseId: sl.loadCase.id, name: 'Checker draft' });
    expect(own.status).toBe(201);
    const withItem = await checker.post(`/api/shortlists/${own.body.id}/items`).send({ propertySetId: acrylic[0].id });
    const ownSubmitted = await checker.post(`/api/shortlists/${own.body.id}/submit`).send({ lockVersion: withItem.body.lockVersion });
    const ownCheck = await checker.post(`/api/shortlists/${own.body.id}/check`).send({ lockVersion: ownSubmitted.body.lockVersion });
    expect(ownCheck.status).toBe(403);
    expect(ownCheck.body.error.code).toBe('own_work');
    // A checker outside the project sees nothing.
    await User.create({ email: 'outside.checker@harrow.example', name: 'Wren Dallow', role: 'checker', passwordHash: await hashPassword('outside-checker-pass'), lastLoginAt: null });
    const outsider = request.agent(handle.app);
    await outsider.post('/api/auth/login').send({ email: 'outside.checker@harrow.example', password: 'outside-checker-pass' }).expect(200);
    expect((await outsider.post(`/api/shortlists/${sl.id}/check`).send({ lockVersion: submitted.body.lockVersion })).status).toBe(404);
  });

  it('returns with a comment, then checks and freezes a design record; mails reach the checkers and the author', async () => {
    const sl = await shortlistReady();
    const s1 = await engineer.post(`/api/shortlists/${sl.id}/submit`).send({ lockVersion: sl.lockVersion });
    const returned = await checker.post(`/api/shortlists/${sl.id}/return`).send({ lockVersion: s1.body.lockVersion, comment: 'Add the temperature-dependent grade.' });
    expect(returned.status).toBe(200);
    expect(returned.body.status).toBe('returned');
    expect(returned.body.returnedComment).toBe('Add the temperature-dependent grade.');
    const s2 = await engineer.post(`/api/shortlists/${sl.id}/submit`).send({ lockVersion: returned.body.lockVersion });
    expect(s2.body.status).toBe('submitted');
    const checked = await checker.post(`/api/shortlists/${sl.id}/check`).send({ lockVersion: s2.body.lockVersion, comment: 'Agreed.' });
    expect(checked.status).toBe(200);
    expect(checked.body.status).toBe('checked');
    expect(checked.body.designRecordId).toEqual(expect.any(Number));
    // Frozen: no more edits.
    expect((await engineer.post(`/api/shortlists/${sl.id}/items`).send({ propertySetId: acrylic[2].id })).status).toBe(409);

    const mail = await listCaughtMail({ limit: 50 });
    const toChecker = mail.filter((m) => m.to.includes('checker@harrow.example') && m.subject.includes('Shortlist to check'));
    const toAuthor = mail.filter((m) => m.to.includes('engineer@harrow.example'));
    expect(toChecker.length).toBeGreaterThanOrEqual(2);
    expect(toAuthor.some((m) => m.subject.startsWith('Shortlist returned') && m.text.includes('Add the temperature-dependent grade.'))).toBe(true);
    expect(toAuthor.some((m) => m.subject.startsWith('Shortlist checked') && m.text.includes(`/records/${checked.body.designRecordId}`))).toBe(true);
  });

  it('keeps a frozen record unchanged when the catalogue changes, and says newer data exists', async () => {
    const sl = await shortlistReady();
    const s = await engineer.post(`/api/shortlists/${sl.id}/submit`).send({ lockVersion: sl.lockVersion });
    const checked = await checker.post(`/api/shortlists/${sl.id}/check`).send({ lockVersion: s.body.lockVersion });
    const recordId = checked.body.designRecordId;
    const before = (await engineer.get(`/api/records/${recordId}`)).body;
    expect(before.newerData).toEqual([]);

    // The catalogue moves on: the set is revised and the new version published; the old one changes too.
    const old = (await PropertySet.findByPk(acrylic[0].id))!;
    const plain = old.get({ plain: true });
    await old.update({ status: 'retired', tensileStrength: plain.tensileStrength * 0.1 });
    const newer = await PropertySet.create({ ...plain, id: undefined, version: plain.version + 1, tensileStrength: plain.tensileStrength * 0.5, status: 'published', supersedesId: old.id, lockVersion: 0 } as never);
    await old.update({ supersededById: newer.id });

    const after = (await engineer.get(`/api/records/${recordId}`)).body;
    expect(after.content).toEqual(before.content);
    expect(after.newerData).toEqual([expect.objectContaining({ propertySetId: old.id, newerVersionId: newer.id })]);
    // The database itself refuses to change a record.
    await expect(DesignRecord.update({ projectId: 1 }, { where: { id: recordId } })).rejects.toThrow(/frozen/);
    await expect(DesignRecord.destroy({ where: { id: recordId } })).rejects.toThrow(/frozen/);
  });

  it('exports the record as a PDF that parses and names the governing mode and the references', async () => {
    const sl = await shortlistReady();
    const s = await engineer.post(`/api/shortlists/${sl.id}/submit`).send({ lockVersion: sl.lockVersion });
    const checked = await checker.post(`/api/shortlists/${sl.id}/check`).send({ lockVersion: s.body.lockVersion });
    const res = await engineer
      .get(`/api/records/${checked.body.designRecordId}/pdf`)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const { pages, text } = await pdfText(res.body as Buffer);
    expect(pages).toBeGreaterThanOrEqual(1);
    const governing = checked.body.items[0].result.governingMode as string;
    expect(text).toContain('Governed by');
    expect(text.toLowerCase()).toContain(governing);
    expect(text).toContain(acrylic[0].reference!.title.slice(0, 30));
    expect(text).toContain('screening estimates for qualified engineers');
    // The PVHO-grade set is sized by the flat-window table: the record names the table, its source and what set the thickness.
    expect(checked.body.items.some((i: { result: { sizedBy: { kind: string } } }) => i.result.sizedBy.kind === 'rating-table')).toBe(true);
    expect(text).toContain('set by rating table: Flat acrylic windows');
    expect(text).toContain('Table 1.5.2');
    expect(text).toContain('Proof test');
    const viewer = await signIn(handle.app, 'viewer');
    expect((await viewer.get(`/api/records/${checked.body.designRecordId}/pdf`)).status).toBe(403);
  });
});

// A citation in use changes only through review; its documents are versioned; a reference cited
// only by drafts is for the library desk. On real PostgreSQL and the fake S3 started by the
// global setup. Every reference, set and project here is invented (Harrow Sound scenario).
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestApp, signIn, type Agent } from '../helpers/app';
import { createAccount, draftBody, signInAs } from '../helpers/library';
import { AuditEntry, Material, PropertySet, RatingTable, Reference, ReferenceVersion, User } from '../../server/db/models';
import { createDraft, stepSet } from '../../server/modules/library/service';
import { addMember, createLoadCase, createProject } from '../../server/modules/projects/service';
import { addItem, createShortlist } from '../../server/modules/projects/shortlists';
import { checkShortlist, submitShortlist } from '../../server/modules/projects/shortlist-steps';
import { draftInputSchema, type PendingReferenceVersionDto, type ReferenceDetailDto, type ReferencePageDto } from '../../shared/schemas/library';
import { loadCaseSaveSchema, type DesignRecordDto } from '../../shared/schemas/projects';
import type { PropertySetDto } from '../../shared/schemas/catalogue';
import type { Role } from '../../shared/roles';

type Actor = { id: number; name: string; role: Role };
let handle: Awaited<ReturnType<typeof startTestApp>>;
const agents = {} as Record<Role | 'second', Agent>;
const people = {} as Record<'librarian' | 'second' | 'engineer' | 'checker', Actor>;
let acrylicId: number;
let n = 0;
const unique = (s: string) => `${s} ${++n}`;

beforeAll(async () => {
  handle = await startTestApp();
  for (const role of ['viewer', 'engineer', 'checker', 'librarian', 'admin'] as const) agents[role] = await signIn(handle.app, role);
  const second = await createAccount('versions.second@harrow.example', 'Loveday Pascoe', 'librarian');
  agents.second = await signInAs(handle.app, 'versions.second@harrow.example');
  const actor = (u: User): Actor => ({ id: u.id, name: u.name, role: u.role });
  for (const role of ['librarian', 'engineer', 'checker'] as const) people[role] = actor((await User.findOne({ where: { email: `${role}@harrow.example` } }))!);
  people.second = actor(second);
  acrylicId = (await Material.findOne({ where: { name: 'Cast acrylic (PMMA)' } }))!.id;
});
afterAll(async () => {
  await handle.stop();
});

const CITATION = {
  kind: 'test-report',
  title: 'Harrow Sound Marine Works flexure tests, chamber port blanks',
  authors: 'Harrow Sound Marine Works test laboratory',
  year: 2026,
  identifier: 'HSMW-TR-0510',
  location: 'Table 2',
} as const;

/** The markers a PDF reader looks for (ISO 32000-1:2008 §7.5.2 and §7.5.5) around random bytes. */
const pdf = (size = 4096) => Buffer.concat([Buffer.from('%PDF-1.7\n'), randomBytes(size), Buffer.from('\n%%EOF\n')]);
const binary = (res: request.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};
const download = (agent: Agent, path: string) => agent.get(path).buffer(true).parse(binary);

async function newReference(overrides: Record<string, unknown> = {}): Promise<ReferencePageDto> {
  const res = await agents.librarian.post('/api/references').send({ ...CITATION, title: unique(CITATION.title), ...overrides });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as ReferencePageDto;
}

/** A draft set by the demo librarian citing `referenceId`; published by the second librarian when asked. */
async function setCiting(referenceId: number, publish: boolean): Promise<number> {
  const draft = await createDraft(draftInputSchema.parse(draftBody(acrylicId, { condition: unique('Harrow Sound port blank lot'), reference: undefined, referenceId })), people.librarian);
  if (!publish) return draft.id;
  const inReview = await stepSet(draft.id, 'submit', { lockVersion: draft.lockVersion }, people.librarian);
  return (await stepSet(inReview.id, 'approve', { lockVersion: inReview.lockVersion }, people.second)).id;
}

/** A reference cited by one published set: in use. */
async function referenceInUse(): Promise<{ ref: ReferencePageDto; setId: number }> {
  const created = await newReference();
  const setId = await setCiting(created.id, true);
  const ref = (await agents.librarian.get(`/api/references/${created.id}`)).body as ReferencePageDto;
  expect(ref.inUse).toBe(true);
  return { ref, setId };
}

const put = (agent: Agent, ref: Citation & { id: number; lockVersion: number }, changes: Record<string, unknown>) =>
  agent.put(`/api/references/${ref.id}`).send({ lockVersion: ref.lockVersion, reference: { ...citationOf(ref), ...changes } });
type Citation = { kind: string; title: string; authors?: string | null; year?: number | null; identifier?: string | null; location?: string | null; note?: string | null };
const citationOf = (r: Citation) =>
  Object.fromEntries(Object.entries({ kind: r.kind, title: r.title, authors: r.authors, year: r.year, identifier: r.identifier, location: r.location, note: r.note }).filter(([, v]) => v !== null && v !== undefined));
const step = (agent: Agent, refId: number, version: number, body: Record<string, unknown>) => agent.post(`/api/references/${refId}/versions/${version}/steps`).send(body);
const page = async (agent: Agent, id: number) => (await agent.get(`/api/references/${id}`)).body as ReferencePageDto;
const publicSet = async (id: number) => (await agents.viewer.get(`/api/property-sets/${id}`)).body as PropertySetDto;

describe('who sees a reference', () => {
  it('gives viewers, engineers and checkers 404 for a reference cited only by drafts (item, documents, list), and librarians and admins 200', async () => {
    const ref = await newReference();
    await setCiting(ref.id, false);
    expect((await agents.librarian.post(`/api/references/${ref.id}/document`).attach('file', pdf(), { filename: 'blanks.pdf', contentType: 'application/pdf' })).status).toBe(200);
    for (const role of ['viewer', 'engineer', 'checker'] as const) {
      const agent = agents[role];
      expect((await agent.get(`/api/references/${ref.id}`)).status, role).toBe(404);
      expect((await agent.get(`/api/references/${ref.id}/documents`)).status, role).toBe(404);
      expect((await agent.get(`/api/references/${ref.id}/document`)).status, role).toBe(404);
      expect((await agent.get(`/api/references/${ref.id}/documents/1`)).status, role).toBe(404);
      const list = (await agent.get(`/api/references?q=${encodeURIComponent(ref.title)}`)).body as { items: ReferenceDetailDto[]; total: number };
      expect(list.items.map((r) => r.id), role).not.toContain(ref.id);
    }
    for (const role of ['librarian', 'admin'] as const) {
      expect((await agents[role].get(`/api/references/${ref.id}`)).body, role).toMatchObject({ id: ref.id, inUse: false, usedBy: 1 });
      expect((await agents[role].get(`/api/references/${ref.id}/document`)).status, role).toBe(200);
      const list = (await agents[role].get(`/api/references?q=${encodeURIComponent(ref.title)}`)).body as { items: ReferenceDetailDto[] };
      expect(list.items.map((r) => r.id), role).toContain(ref.id);
    }
    // The viewer's list holds only references in use.
    const all = (await agents.viewer.get('/api/references')).body as { items: ReferenceDetailDto[]; total: number };
    expect(all.items.every((r) => r.inUse)).toBe(true);
    expect(all.total).toBe(await ReferenceVersion.count({ where: { status: 'published' } }));
  });

  it('shows the reference to every role once a set citing it is published', async () => {
    const ref = await newReference();
    const draftId = await setCiting(ref.id, false);
    expect((await agents.viewer.get(`/api/references/${ref.id}`)).status).toBe(404);
    const draft = (await PropertySet.findByPk(draftId))!;
    const inReview = await stepSet(draftId, 'submit', { lockVersion: draft.lockVersion }, people.librarian);
    await stepSet(draftId, 'approve', { lockVersion: inReview.lockVersion }, people.second);
    const seen = await agents.viewer.get(`/api/references/${ref.id}`);
    expect(seen.status).toBe(200);
    expect(seen.body).toMatchObject({ inUse: true, version: 1, pending: null, versions: [{ version: 1, status: 'published', citation: { title: ref.title } }] });
  });
});

describe('changing a reference', () => {
  it('edits a reference cited only by drafts in place (200), and the draft shows the new citation', async () => {
    const ref = await newReference();
    const draftId = await setCiting(ref.id, false);
    const res = await put(agents.librarian, ref, { location: 'Table 4' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ location: 'Table 4', version: 1, lockVersion: 1, inUse: false, pending: null, versions: [] });
    const draft = (await agents.librarian.get(`/api/library/sets/${draftId}`)).body as PropertySetDto;
    expect(draft.reference).toMatchObject({ id: ref.id, location: 'Table 4', version: 1 });
    expect(await ReferenceVersion.count({ where: { referenceId: ref.id } })).toBe(0);
  });

  it('turns an edit of a reference in use into a pending version; the published citation stays until a second librarian approves it', async () => {
    const { ref, setId } = await referenceInUse();
    const newTitle = `${ref.title}, second issue`;
    const auditBefore = await AuditEntry.count();

    const proposed = await put(agents.librarian, ref, { title: newTitle, year: 2027 });
    expect(proposed.status, JSON.stringify(proposed.body)).toBe(202);
    const body = proposed.body as ReferencePageDto;
    // The reference itself, and the published set citing it, are as they were.
    expect(body).toMatchObject({ title: ref.title, year: 2026, version: 1, lockVersion: ref.lockVersion, inUse: true });
    expect(body.pending).toMatchObject({ version: 2, status: 'draft', citation: { title: newTitle, year: 2027 }, draftedBy: { id: people.librarian.id } });
    expect(body.pending!.changes).toEqual([
      { field: 'title', before: ref.title, after: newTitle },
      { field: 'year', before: 2026, after: 2027 },
    ]);
    expect((await Reference.findByPk(ref.id))!.title).toBe(ref.title);
    expect((await publicSet(setId)).reference).toMatchObject({ title: ref.title, version: 1, latestVersion: 1 });
    const proposal = await AuditEntry.findAll({ where: { entityType: 'reference-version', entityId: String(body.pending!.id) } });
    expect(proposal.map((e) => [e.action, e.actorId])).toEqual([['propose', people.librarian.id]]);
    expect(await AuditEntry.count()).toBe(auditBefore + 1);

    // Readers see the published versions only; the desk sees the proposal.
    const forViewer = await page(agents.viewer, ref.id);
    expect(forViewer.pending).toBeNull();
    expect(forViewer.versions.map((v) => v.version)).toEqual([1]);

    // A second proposal while one is open is refused.
    const again = await put(agents.second, ref, { title: `${ref.title}, third issue` });
    expect([again.status, again.body.error.code]).toEqual([409, 'revision_open']);

    const submitted = await step(agents.librarian, ref.id, 2, { step: 'submit', lockVersion: body.pending!.lockVersion });
    expect(submitted.status, JSON.stringify(submitted.body)).toBe(200);
    const inReview = (submitted.body as ReferencePageDto).pending!;
    expect(inReview).toMatchObject({ status: 'in-review', submittedAt: expect.any(String) });

    // Four-eyes: its author cannot approve it, and nothing changes.
    const own = await step(agents.librarian, ref.id, 2, { step: 'approve', lockVersion: inReview.lockVersion });
    expect([own.status, own.body.error.code]).toEqual([403, 'own_work']);
    expect((await ReferenceVersion.findByPk(inReview.id))!.status).toBe('in-review');
    expect((await publicSet(setId)).reference!.title).toBe(ref.title);
    // Nor can an engineer (no role), nor anyone from an older read.
    expect((await step(agents.engineer, ref.id, 2, { step: 'approve', lockVersion: inReview.lockVersion })).status).toBe(403);
    const late = await step(agents.second, ref.id, 2, { step: 'approve', lockVersion: inReview.lockVersion - 1 });
    expect([late.status, late.body.error.code]).toEqual([409, 'stale']);

    const approved = await step(agents.second, ref.id, 2, { step: 'approve', lockVersion: inReview.lockVersion });
    expect(approved.status, JSON.stringify(approved.body)).toBe(200);
    const after = approved.body as ReferencePageDto;
    expect(after).toMatchObject({ title: newTitle, year: 2027, version: 2, lockVersion: ref.lockVersion + 1, pending: null });
    expect(after.versions.map((v) => [v.version, v.status, v.approvedBy?.id ?? null])).toEqual([
      [2, 'published', people.second.id],
      [1, 'retired', null],
    ]);
    const publication = await agents.admin.get(`/api/admin/audit?entityType=reference&entityId=${ref.id}`);
    expect(publication.body.items[0]).toMatchObject({ action: 'publish-version', before: { title: ref.title, version: 1 }, after: { title: newTitle, version: 2 } });
    const versionAudit = await agents.admin.get(`/api/admin/audit?entityType=reference-version&entityId=${inReview.id}`);
    expect(versionAudit.body.items.map((e: { action: string }) => e.action)).toEqual(['approve', 'submit', 'propose']);
  });

  it('keeps a published set (and a published rating table) on the version it was approved with until it is revised', async () => {
    const { ref, setId } = await referenceInUse();
    const table = (await RatingTable.findOne({ where: { status: 'published' }, order: [['id', 'ASC']] }))!;
    const tableRef = (await page(agents.librarian, table.referenceId!)) as ReferencePageDto;
    for (const [r, title] of [
      [ref, `${ref.title} (corrected)`],
      [tableRef, `${tableRef.title} (corrected)`],
    ] as const) {
      const proposed = (await put(agents.librarian, r, { title })).body as ReferencePageDto;
      const submitted = (await step(agents.librarian, r.id, proposed.pending!.version, { step: 'submit', lockVersion: proposed.pending!.lockVersion })).body as ReferencePageDto;
      expect((await step(agents.second, r.id, proposed.pending!.version, { step: 'approve', lockVersion: submitted.pending!.lockVersion })).status).toBe(200);
    }

    expect((await publicSet(setId)).reference).toMatchObject({ id: ref.id, title: ref.title, version: 1, latestVersion: 2 });
    const tableNow = (await agents.viewer.get(`/api/rating-tables/${table.id}`)).body as { reference: { title: string; version: number } };
    expect(tableNow.reference).toMatchObject({ title: tableRef.title, version: tableRef.version });

    // A revision cites the reference as it is now, and keeps that version once published.
    const set = (await PropertySet.findByPk(setId))!;
    const revision = await stepSet(setId, 'revise', { lockVersion: set.lockVersion }, people.librarian);
    expect(revision.reference).toMatchObject({ title: `${ref.title} (corrected)`, version: 2 });
    const inReview = await stepSet(revision.id, 'submit', { lockVersion: revision.lockVersion }, people.librarian);
    await stepSet(revision.id, 'approve', { lockVersion: inReview.lockVersion }, people.second);
    expect((await publicSet(revision.id)).reference).toMatchObject({ title: `${ref.title} (corrected)`, version: 2 });
    expect((await publicSet(setId)).reference).toMatchObject({ title: ref.title, version: 1 });
  });

  it('returns a proposed change to its author, who edits it and submits it again', async () => {
    const { ref } = await referenceInUse();
    // A proposal that changes nothing is refused, and leaves nothing behind.
    const same = await put(agents.librarian, ref, {});
    expect([same.status, Object.keys(same.body.error.fields)]).toEqual([400, ['reference']]);
    expect(await ReferenceVersion.count({ where: { referenceId: ref.id } })).toBe(1);
    const proposed = ((await put(agents.librarian, ref, { location: 'Table 3' })).body as ReferencePageDto).pending!;
    const submitted = ((await step(agents.librarian, ref.id, 2, { step: 'submit', lockVersion: proposed.lockVersion })).body as ReferencePageDto).pending!;
    expect((await step(agents.second, ref.id, 2, { step: 'return', lockVersion: submitted.lockVersion })).status).toBe(400);
    const returned = await step(agents.second, ref.id, 2, { step: 'return', lockVersion: submitted.lockVersion, comment: 'Table 3 is the creep data; the flexure results are in Table 5.' });
    expect(returned.status).toBe(200);
    const back = (returned.body as ReferencePageDto).pending!;
    expect(back).toMatchObject({ status: 'draft', returnedComment: 'Table 3 is the creep data; the flexure results are in Table 5.' });

    const edit = (lockVersion: number, location: string) => agents.librarian.put(`/api/references/${ref.id}/versions/2`).send({ lockVersion, reference: { ...citationOf(ref), location } });
    const stale = await edit(back.lockVersion - 1, 'Table 5');
    expect([stale.status, stale.body.error.code]).toEqual([409, 'stale']);
    const bad = await agents.librarian.put(`/api/references/${ref.id}/versions/2`).send({ lockVersion: back.lockVersion, reference: { ...citationOf(ref), year: 1066 } });
    expect([bad.status, Object.keys(bad.body.error.fields)]).toEqual([400, ['reference.year']]);
    const saved = await edit(back.lockVersion, 'Table 5');
    expect(saved.status).toBe(200);
    expect((saved.body as ReferencePageDto).pending).toMatchObject({ citation: { location: 'Table 5' }, changes: [{ field: 'location', before: 'Table 2', after: 'Table 5' }] });
    expect((await agents.viewer.put(`/api/references/${ref.id}/versions/2`).send({ lockVersion: 0, reference: citationOf(ref) })).status).toBe(403);

    // A version in review is not edited; steps on a missing version are 404, a bad step 400.
    const again = ((await step(agents.librarian, ref.id, 2, { step: 'submit', lockVersion: (saved.body as ReferencePageDto).pending!.lockVersion })).body as ReferencePageDto).pending!;
    const late = await edit(again.lockVersion, 'Table 6');
    expect([late.status, late.body.error.code]).toEqual([409, 'wrong_status']);
    expect((await step(agents.second, ref.id, 9, { step: 'approve', lockVersion: 0 })).status).toBe(404);
    expect((await step(agents.second, ref.id, 2, { step: 'retire', lockVersion: again.lockVersion })).status).toBe(400);
    expect((await step(agents.viewer, ref.id, 2, { step: 'approve', lockVersion: again.lockVersion })).status).toBe(403);

    // The desk's queue lists it, with the citation it would replace.
    const queue = await agents.second.get('/api/library/reference-versions?status=in-review');
    expect(queue.status).toBe(200);
    const item = (queue.body.items as PendingReferenceVersionDto[]).find((v) => v.referenceId === ref.id);
    expect(item).toMatchObject({ version: 2, status: 'in-review', citation: { location: 'Table 5' }, current: { version: 1, location: 'Table 2' } });
    expect((await agents.second.get('/api/library/reference-versions?status=published')).status).toBe(400);
    expect((await agents.viewer.get('/api/library/reference-versions')).status).toBe(403);
  });
});

describe('design records', () => {
  it('keep pointing at the reference version and document version they were frozen with', async () => {
    const ref = await newReference();
    const first = pdf(6000);
    expect((await agents.librarian.post(`/api/references/${ref.id}/document`).attach('file', first, { filename: 'flexure-tests.pdf', contentType: 'application/pdf' })).status).toBe(200);
    const setId = await setCiting(ref.id, true);

    const project = await createProject(people.engineer, { name: unique('TC-5 port record'), description: 'Harrow Sound treatment chamber' });
    await addMember(people.engineer, project.id, people.checker.id);
    const lc = await createLoadCase(
      people.engineer,
      project.id,
      loadCaseSaveSchema.parse({
        name: 'Side port',
        loadCase: { pressure: { value: 0.5e6 }, temperature: { min: 15, max: 40 }, sustainedHours: 5000, cycles: 10000, component: { type: 'flat-disc', diameter: 0.25, thickness: 0.04, edge: 'clamped' } },
      }),
    );
    const sl = await addItem(people.engineer, (await createShortlist(people.engineer, project.id, { loadCaseId: lc.id, name: 'Port blank' })).id, { propertySetId: setId, note: '' });
    const submitted = await submitShortlist(people.engineer, sl.id, sl.lockVersion);
    const recordId = (await checkShortlist(people.checker, submitted.id, submitted.lockVersion, undefined)).designRecordId!;

    // Afterwards: a second document, and a reviewed change of the citation.
    const second = pdf(9000);
    expect((await agents.librarian.post(`/api/references/${ref.id}/document`).attach('file', second, { filename: 'flexure-tests-rev-b.pdf', contentType: 'application/pdf' })).status).toBe(200);
    const current = await page(agents.librarian, ref.id);
    const proposed = ((await put(agents.librarian, current, { title: `${ref.title}, rev B` })).body as ReferencePageDto).pending!;
    const inReview = ((await step(agents.librarian, ref.id, 2, { step: 'submit', lockVersion: proposed.lockVersion })).body as ReferencePageDto).pending!;
    expect((await step(agents.second, ref.id, 2, { step: 'approve', lockVersion: inReview.lockVersion })).status).toBe(200);

    const record = (await agents.engineer.get(`/api/records/${recordId}`)).body as DesignRecordDto;
    const cited = record.content.candidates[0].propertySet.reference!;
    expect(cited).toMatchObject({ id: ref.id, title: ref.title, version: 1, documentVersion: 1 });
    // The frozen document version is the first upload, byte for byte, for a member of the project.
    const frozen = await download(agents.engineer, `/api/references/${ref.id}/documents/${cited.documentVersion}`);
    expect(frozen.status).toBe(200);
    expect(Buffer.compare(frozen.body as Buffer, first)).toBe(0);
    const latest = await download(agents.engineer, `/api/references/${ref.id}/document`);
    expect(Buffer.compare(latest.body as Buffer, second)).toBe(0);
    expect(await page(agents.engineer, ref.id)).toMatchObject({ title: `${ref.title}, rev B`, version: 2, document: { version: 2 } });
  });
});

// References, their PDF documents (stored in the fake S3 started by the global setup) and
// materials on the library desk.
import { randomBytes } from 'node:crypto';
import { request as httpRequest } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import request from 'supertest';
import { ListObjectsV2Command } from '@aws-sdk/client-s3';
import { startTestApp, signIn, demoEmail, type Agent } from '../helpers/app';
import { DEMO_PASSWORD } from '../../server/db/seeders/demo';
import { createAccount, signInAs } from '../helpers/library';
import { Material, Reference } from '../../server/db/models';
import { AppError } from '../../server/errors';
import { documentExists, storageClient } from '../../server/services/storage';
import { env } from '../../server/config/env';
import { DOCUMENT_MAX_BYTES, type ReferenceDetailDto } from '../../shared/schemas/library';

let handle: Awaited<ReturnType<typeof startTestApp>>;
let librarian: Agent;
let second: Agent;
let admin: Agent;
let viewer: Agent;
let engineer: Agent;

beforeAll(async () => {
  handle = await startTestApp();
  await createAccount('references.librarian@harrow.example', 'Corran Vell', 'librarian');
  librarian = await signIn(handle.app, 'librarian');
  second = await signInAs(handle.app, 'references.librarian@harrow.example');
  admin = await signIn(handle.app, 'admin');
  viewer = await signIn(handle.app, 'viewer');
  engineer = await signIn(handle.app, 'engineer');
});
afterEach(() => {
  vi.restoreAllMocks();
});
afterAll(async () => {
  await handle.stop();
});

const REFERENCE = {
  kind: 'test-report',
  title: 'Harrow Sound Marine Works hydrostatic proof tests, camera housing dome',
  authors: 'Harrow Sound Marine Works test laboratory',
  year: 2026,
  identifier: 'HSMW-TR-0400',
  location: 'Section 4',
};

async function newReference(overrides: Record<string, unknown> = {}): Promise<ReferenceDetailDto> {
  const res = await librarian.post('/api/references').send({ ...REFERENCE, ...overrides });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as ReferenceDetailDto;
}

/**
 * A small file a PDF reader accepts by its markers: the "%PDF-1.7" header and the "%%EOF" marker
 * (ISO 32000-1:2008 §7.5.2 and §7.5.5), with every byte value in between so a copy that is not
 * byte-for-byte identical shows.
 */
function pdf(size = 4096): Buffer {
  const body = Buffer.concat([Buffer.from(Array.from({ length: 256 }, (_, i) => i)), randomBytes(Math.max(0, size - 256 - 20))]);
  return Buffer.concat([Buffer.from('%PDF-1.7\n%\xe2\xe3\xcf\xd3\n', 'latin1'), body, Buffer.from('\n%%EOF\n')]);
}

async function objectsUnder(prefix: string): Promise<string[]> {
  const out = await storageClient().send(new ListObjectsV2Command({ Bucket: env().S3_BUCKET, Prefix: prefix }));
  return (out.Contents ?? []).map((o) => o.Key!);
}

/**
 * The objects a test left under a reference's prefix. The fake store lives as long as the whole
 * test run while each file starts from a fresh database (ids from 1 again), and stored documents
 * are never deleted, so what earlier files stored under the same id is not counted.
 */
async function storedByThisTest(id: number, before: string[]): Promise<string[]> {
  return (await objectsUnder(`references/${id}/`)).filter((k) => !before.includes(k)).sort();
}

const uploadTo = (agent: Agent, id: number, content: Buffer, filename = 'proof-tests.pdf', contentType = 'application/pdf') =>
  agent.post(`/api/references/${id}/document`).attach('file', content, { filename, contentType });

const binary = (res: request.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

describe('references', () => {
  it('lists the seeded references with how many sets cite each, to any signed-in role, and 401 anonymously', async () => {
    const res = await viewer.get('/api/references');
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(await Reference.count());
    expect(res.body.total).toBeGreaterThanOrEqual(20);
    const items = res.body.items as ReferenceDetailDto[];
    expect(items.every((r) => r.usedBy >= 1)).toBe(true);
    expect(items.reduce((n, r) => n + r.usedBy, 0)).toBeGreaterThanOrEqual(40);
    expect(items[0]).toMatchObject({ version: 1, lockVersion: 0, document: null, hasDocument: false, inUse: true });
    expect((await request(handle.app).get('/api/references')).status).toBe(401);
  });

  it('filters by words of the title, authors or identifier', async () => {
    const ref = await newReference({ title: 'Harrow Sound chamber viewport creep series', identifier: 'HSMW-TR-0455' });
    const res = await librarian.get('/api/references?q=creep%20hsmw-tr-0455');
    expect(res.status).toBe(200);
    expect((res.body.items as ReferenceDetailDto[]).map((r) => r.id)).toEqual([ref.id]);
    expect((await viewer.get('/api/references?colour=blue')).status).toBe(400);
  });

  it('creates a reference (librarian) with an audit entry, and refuses viewers and engineers (403)', async () => {
    const ref = await newReference();
    expect(ref).toMatchObject({ ...REFERENCE, id: expect.any(Number), version: 1, lockVersion: 0, usedBy: 0, inUse: false, document: null, note: null, versions: [], pending: null, documents: [] });
    expect((await viewer.post('/api/references').send(REFERENCE)).status).toBe(403);
    expect((await engineer.post('/api/references').send(REFERENCE)).status).toBe(403);
    const audit = await admin.get(`/api/admin/audit?entityType=reference&entityId=${ref.id}`);
    expect(audit.body.items.map((e: { action: string }) => e.action)).toEqual(['create']);
  });

  it.each([
    [{ ...REFERENCE, kind: 'rumour' }, 'kind'],
    [{ ...REFERENCE, title: '' }, 'title'],
    [{ ...REFERENCE, year: 1066 }, 'year'],
    [{ ...REFERENCE, pages: 12 }, 'pages'],
  ])('refuses a bad reference with 400 naming the field (%#)', async (body, field) => {
    const res = await librarian.post('/api/references').send(body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain(field);
  });

  it('edits with the current lock version, and answers 409 "stale" to an old one without changing the row', async () => {
    const ref = await newReference();
    const ok = await librarian.put(`/api/references/${ref.id}`).send({ lockVersion: 0, reference: { ...REFERENCE, location: 'Section 5' } });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ location: 'Section 5', lockVersion: 1 });
    const late = await second.put(`/api/references/${ref.id}`).send({ lockVersion: 0, reference: { ...REFERENCE, location: 'Appendix B' } });
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('stale');
    expect((await Reference.findByPk(ref.id))!.location).toBe('Section 5');
    const audit = await admin.get(`/api/admin/audit?entityType=reference&entityId=${ref.id}`);
    expect(audit.body.items[0]).toMatchObject({ action: 'edit', before: { location: 'Section 4' }, after: { location: 'Section 5' } });
  });

  it('lets one of two simultaneous edits with the same lock version through and refuses the other', async () => {
    const ref = await newReference();
    const [a, b] = await Promise.all([
      librarian.put(`/api/references/${ref.id}`).send({ lockVersion: 0, reference: { ...REFERENCE, year: 2025 } }),
      second.put(`/api/references/${ref.id}`).send({ lockVersion: 0, reference: { ...REFERENCE, year: 2024 } }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const winner = a.status === 200 ? a : b;
    const stored = await Reference.findByPk(ref.id);
    expect(stored!.year).toBe(winner.body.year);
    expect(stored!.lockVersion).toBe(1);
  });

  it('answers 404 for a missing reference and 403 to a viewer editing one', async () => {
    expect((await viewer.get('/api/references/999999')).status).toBe(404);
    const ref = await newReference();
    expect((await viewer.put(`/api/references/${ref.id}`).send({ lockVersion: 0, reference: REFERENCE })).status).toBe(403);
  });
});

describe('reference documents', () => {
  it('stores a PDF in the object store and gives it back byte for byte, as an attachment', async () => {
    const ref = await newReference();
    const file = pdf(64 * 1024);
    const res = await uploadTo(librarian, ref.id, file, 'HSMW proof tests (rev 2).pdf');
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.document).toEqual({ name: 'HSMW-proof-tests-rev-2.pdf', size: file.length, uploadedAt: expect.any(String), version: 1 });

    const row = await Reference.findByPk(ref.id);
    expect(row!.documentKey).toMatch(new RegExp(`^references/${ref.id}/[a-z0-9]+-[0-9a-f]{12}-HSMW-proof-tests-rev-2\\.pdf$`));
    expect(await documentExists(row!.documentKey!)).toBe(true);

    const download = await second.get(`/api/references/${ref.id}/document`).buffer(true).parse(binary);
    expect(download.status).toBe(200);
    expect(download.headers['content-type']).toBe('application/pdf');
    expect(download.headers['content-disposition']).toBe('attachment; filename="HSMW-proof-tests-rev-2.pdf"');
    expect(Buffer.compare(download.body as Buffer, file)).toBe(0);
    expect((await request(handle.app).get(`/api/references/${ref.id}/document`)).status).toBe(401);
    expect((await second.get(`/api/references/${ref.id}`)).body.hasDocument).toBe(true);

    const audit = await admin.get(`/api/admin/audit?entityType=reference&entityId=${ref.id}`);
    expect(audit.body.items[0]).toMatchObject({
      action: 'upload',
      before: { document: null },
      after: { document: { key: row!.documentKey, name: 'HSMW-proof-tests-rev-2.pdf', size: file.length, version: 1 } },
    });
  });

  it('adds a second upload as version 2: the latest is served, and the first stays stored and downloadable', async () => {
    const ref = await newReference();
    const before = await objectsUnder(`references/${ref.id}/`);
    const first = pdf();
    expect((await uploadTo(librarian, ref.id, first, 'proof-tests.pdf')).status).toBe(200);
    const oldKey = (await Reference.findByPk(ref.id))!.documentKey!;
    const next = pdf(8192);
    const res = await uploadTo(second, ref.id, next, 'proof-tests-v2.pdf');
    expect(res.status).toBe(200);
    expect(res.body.document).toMatchObject({ name: 'proof-tests-v2.pdf', version: 2 });
    expect((res.body.documents as { version: number; name: string; uploadedBy: { name: string } }[]).map((d) => [d.version, d.name, d.uploadedBy.name])).toEqual([
      [2, 'proof-tests-v2.pdf', 'Corran Vell'],
      [1, 'proof-tests.pdf', 'Tamsin Oyelaran'],
    ]);
    const newKey = (await Reference.findByPk(ref.id))!.documentKey!;
    expect(newKey).not.toBe(oldKey);
    expect(await documentExists(oldKey)).toBe(true);
    expect(await storedByThisTest(ref.id, before)).toEqual([oldKey, newKey].sort());

    const latest = await librarian.get(`/api/references/${ref.id}/document`).buffer(true).parse(binary);
    expect(Buffer.compare(latest.body as Buffer, next)).toBe(0);
    const v1 = await librarian.get(`/api/references/${ref.id}/documents/1`).buffer(true).parse(binary);
    expect(v1.status).toBe(200);
    expect(v1.headers['content-disposition']).toBe('attachment; filename="proof-tests.pdf"');
    expect(Buffer.compare(v1.body as Buffer, first)).toBe(0);
    const v2 = await librarian.get(`/api/references/${ref.id}/documents/2`).buffer(true).parse(binary);
    expect(Buffer.compare(v2.body as Buffer, next)).toBe(0);
    const list = await librarian.get(`/api/references/${ref.id}/documents`);
    expect(list.status).toBe(200);
    expect((list.body.items as { version: number; size: number }[]).map((d) => [d.version, d.size])).toEqual([
      [2, next.length],
      [1, first.length],
    ]);
    expect((await librarian.get(`/api/references/${ref.id}/documents/3`)).status).toBe(404);
    expect((await librarian.get(`/api/references/${ref.id}/documents/first`)).status).toBe(400);
    expect((await librarian.get(`/api/references/${ref.id}/documents?all=1`)).status).toBe(400);

    const audit = await admin.get(`/api/admin/audit?entityType=reference&entityId=${ref.id}`);
    expect(audit.body.items[0]).toMatchObject({ action: 'upload', before: { document: { key: oldKey, version: 1 } }, after: { document: { key: newKey, version: 2 } } });
  });

  // Reproduces finding 7 of the account-safety assessment: non-ASCII upload names were read as Latin-1.
  it('reads a non-ASCII file name as UTF-8 (browsers send it so): accents fold to their letters', async () => {
    const ref = await newReference();
    const res = await uploadTo(librarian, ref.id, pdf(), 'Prüfbericht Fenster Ø200 – Harrow.pdf');
    expect(res.status).toBe(200);
    expect(res.body.document.name).toBe('Prufbericht-Fenster-200-Harrow.pdf');
  });

  it('keeps the file name safe: no path, no quotes, nothing outside letters, digits, dot, dash and underscore', async () => {
    const ref = await newReference();
    const res = await uploadTo(librarian, ref.id, pdf(), '../../etc/"passwd"; rm -rf.pdf');
    expect(res.status).toBe(200);
    expect(res.body.document.name).toMatch(/^[A-Za-z0-9._-]+\.pdf$/);
    const download = await librarian.get(`/api/references/${ref.id}/document`);
    expect(download.headers['content-disposition']).toBe(`attachment; filename="${res.body.document.name}"`);
  });

  it('refuses a file that is not a PDF by its content (400), whatever its name, leaving no record and no object', async () => {
    const ref = await newReference();
    const before = await objectsUnder(`references/${ref.id}/`);
    // A PNG signature (ISO/IEC 15948 §5.2), sent as "report.pdf" with a PDF media type.
    const png = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), randomBytes(2048)]);
    const res = await uploadTo(librarian, ref.id, png, 'report.pdf');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('not_pdf');
    expect((await Reference.findByPk(ref.id))!.documentKey).toBeNull();
    expect(await storedByThisTest(ref.id, before)).toEqual([]);
    expect((await librarian.get(`/api/references/${ref.id}/document`)).status).toBe(404);
    expect((await librarian.get(`/api/references/${ref.id}/documents`)).body.items).toEqual([]);
  });

  it('refuses a file over 20 MB with 413 "too_large", leaving no record and no object', async () => {
    const ref = await newReference();
    const before = await objectsUnder(`references/${ref.id}/`);
    const big = pdf(DOCUMENT_MAX_BYTES + 1);
    expect(big.length).toBeGreaterThan(DOCUMENT_MAX_BYTES);
    const res = await uploadTo(librarian, ref.id, big);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_large');
    expect((await Reference.findByPk(ref.id))!.documentKey).toBeNull();
    expect(await storedByThisTest(ref.id, before)).toEqual([]);
  });

  it('deletes the stored object when recording it fails, so nothing is orphaned', async () => {
    const ref = await newReference();
    const before = await objectsUnder(`references/${ref.id}/`);
    vi.spyOn(Reference, 'update').mockRejectedValueOnce(new AppError(503, 'unavailable', 'The database is unavailable. Try again in a moment.'));
    const res = await uploadTo(librarian, ref.id, pdf());
    expect(res.status).toBe(503);
    expect((await Reference.findByPk(ref.id))!.documentKey).toBeNull();
    expect(await storedByThisTest(ref.id, before)).toEqual([]);
    const audit = await admin.get(`/api/admin/audit?entityType=reference&entityId=${ref.id}`);
    expect(audit.body.items.map((e: { action: string }) => e.action)).toEqual(['create']);
  });

  it('leaves no record and no object when the upload is cut off half way', async () => {
    const ref = await newReference();
    const before = await objectsUnder(`references/${ref.id}/`);
    const server = handle.app.listen(0, '127.0.0.1');
    await new Promise<void>((resolve) => server.once('listening', () => resolve()));
    const { port } = server.address() as AddressInfo;
    // The session cookie of a librarian, checked to work, so the cut-off request reaches the upload.
    const login = await request(handle.app).post('/api/auth/login').send({ email: demoEmail('librarian'), password: DEMO_PASSWORD });
    const jar = String((login.headers['set-cookie'] as unknown as string[])[0]).split(';')[0];
    expect((await request(handle.app).get('/api/auth/me').set('Cookie', jar)).status).toBe(200);
    const boundary = 'isobath-cut-off-upload';
    const head = Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="half.pdf"\r\nContent-Type: application/pdf\r\n\r\n`);
    const half = pdf(256 * 1024).subarray(0, 100 * 1024);
    const closed = new Promise<void>((resolve) => {
      const req = httpRequest({
        host: '127.0.0.1',
        port,
        method: 'POST',
        path: `/api/references/${ref.id}/document`,
        headers: { 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': String(head.length + 256 * 1024 + 100), cookie: jar },
      });
      req.on('error', () => resolve());
      req.on('close', () => resolve());
      req.write(Buffer.concat([head, half]), () => setTimeout(() => req.destroy(), 100));
    });
    await closed;
    await new Promise((resolve) => setTimeout(resolve, 300));
    await new Promise<void>((resolve) => server.close(() => resolve()));
    expect((await Reference.findByPk(ref.id))!.documentKey).toBeNull();
    expect(await storedByThisTest(ref.id, before)).toEqual([]);
  });

  it('refuses uploads from viewers and engineers (403) and anonymous callers (401)', async () => {
    const ref = await newReference();
    const before = await objectsUnder(`references/${ref.id}/`);
    expect((await uploadTo(viewer, ref.id, pdf())).status).toBe(403);
    expect((await uploadTo(engineer, ref.id, pdf())).status).toBe(403);
    const anon = await request(handle.app).post(`/api/references/${ref.id}/document`).attach('file', pdf(), 'x.pdf');
    expect(anon.status).toBe(401);
    expect(await storedByThisTest(ref.id, before)).toEqual([]);
  });

  it('answers 404 for an upload to a missing reference (nothing stored), and 400 without a file', async () => {
    const missing = await uploadTo(librarian, 999999, pdf());
    expect(missing.status).toBe(404);
    expect(await objectsUnder('references/999999/')).toEqual([]);
    const ref = await newReference();
    const none = await librarian.post(`/api/references/${ref.id}/document`).send({});
    expect(none.status).toBe(400);
    expect(Object.keys(none.body.error.fields)).toEqual(['file']);
  });
});

describe('materials', () => {
  it('lists every material by family then name, to any signed-in role', async () => {
    const res = await viewer.get('/api/materials');
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(await Material.count());
    const keys = (res.body.items as { family: string; name: string }[]).map((m) => `${m.family}\u0000${m.name}`);
    expect(keys).toEqual([...keys].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0)));
    expect((await request(handle.app).get('/api/materials')).status).toBe(401);
  });

  it('creates a material (librarian) with an audit entry; a name clash in any case is 409 "duplicate"', async () => {
    const res = await librarian.post('/api/materials').send({ name: 'Harrow Sound trial borosilicate HS-B2', family: 'glass', transparent: true });
    expect(res.status).toBe(201);
    expect(res.body).toEqual({ id: expect.any(Number), name: 'Harrow Sound trial borosilicate HS-B2', family: 'glass', transparent: true, description: null });
    const clash = await second.post('/api/materials').send({ name: 'harrow sound trial BOROSILICATE hs-b2', family: 'glass', transparent: true });
    expect(clash.status).toBe(409);
    expect(clash.body.error.code).toBe('duplicate');
    const audit = await admin.get(`/api/admin/audit?entityType=material&entityId=${res.body.id}`);
    expect(audit.body.items).toHaveLength(1);
    expect(audit.body.items[0]).toMatchObject({ action: 'create', after: { name: 'Harrow Sound trial borosilicate HS-B2' } });
  });

  it('refuses engineers and viewers (403) and bad input (400)', async () => {
    const body = { name: 'Harrow Sound trial polycarbonate HS-P1', family: 'polycarbonate', transparent: true };
    expect((await engineer.post('/api/materials').send(body)).status).toBe(403);
    expect((await viewer.post('/api/materials').send(body)).status).toBe(403);
    const bad = await librarian.post('/api/materials').send({ ...body, family: 'cheese' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toContain('family');
  });
});

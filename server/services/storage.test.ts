// Runs the document service against the local S3 fake (s3rver) started in-process on a free port.
import { randomBytes } from 'node:crypto';
import { mkdtemp, readdir, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { startS3Fake, type S3Fake } from '../../scripts/fakes/s3';
import {
  DocumentNotFoundError,
  InvalidDocumentKeyError,
  StorageError,
  closeStorage,
  deleteDocument,
  documentExists,
  ensureBucket,
  getDocument,
  putDocument,
} from './storage';
import { closedPort, serviceTestEnv } from './test-env';

const BUCKET = 'isobath-documents-test';
const useEnv = serviceTestEnv(closeStorage);
let dataDir: string;
let fake: S3Fake;

async function readAll(stream: Readable): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(Buffer.from(chunk));
  return Buffer.concat(chunks);
}

async function filesUnder(dir: string): Promise<string[]> {
  const entries = await readdir(dir, { withFileTypes: true, recursive: true });
  return entries.filter((e) => e.isFile()).map((e) => path.join(e.parentPath, e.name));
}

beforeAll(async () => {
  dataDir = await mkdtemp(path.join(tmpdir(), 'isobath-storage-'));
  fake = await startS3Fake({ port: 0, directory: dataDir, bucket: BUCKET });
});

afterAll(async () => {
  closeStorage();
  await fake?.stop();
  await rm(dataDir, { recursive: true, force: true });
});

describe('document storage on the S3 fake', () => {
  beforeAll(() => {
    useEnv({
      NODE_ENV: 'test',
      SESSION_SECRET: 'storage-test-secret-storage-test-secret',
      S3_ENDPOINT: fake.endpoint,
      S3_BUCKET: BUCKET,
      S3_REGION: 'us-east-1',
      S3_ACCESS_KEY_ID: undefined, // the non-production default, the fake's key
      S3_SECRET_ACCESS_KEY: undefined,
      S3_FORCE_PATH_STYLE: 'true',
    });
  });

  it('stores a buffer, reads it back byte-identical, then deletes it', async () => {
    const key = 'documents/harrow-sound/viewport-drawing-rev-B.pdf';
    // Every byte value, then random bytes: nothing may be re-encoded on the way.
    const body = Buffer.concat([Buffer.from(Array.from({ length: 256 }, (_, i) => i)), randomBytes(200_000)]);

    await expect(putDocument({ key, body, contentType: 'application/pdf' })).resolves.toEqual({ key, size: body.length });
    expect(await documentExists(key)).toBe(true);

    const stored = await getDocument(key);
    expect(stored.contentType).toBe('application/pdf');
    expect(stored.contentLength).toBe(body.length);
    expect((await readAll(stored.stream)).equals(body)).toBe(true);

    // The fake keeps the object as a file under its directory.
    const files = await filesUnder(dataDir);
    const contents = await Promise.all(files.map((f) => readFile(f)));
    expect(contents.some((c) => c.equals(body))).toBe(true);

    await deleteDocument(key);
    expect(await documentExists(key)).toBe(false);
    await expect(getDocument(key)).rejects.toBeInstanceOf(DocumentNotFoundError);
    await expect(getDocument(key)).rejects.toMatchObject({ status: 404, code: 'not_found' });
    // Deleting what is already gone succeeds, as S3's DeleteObject does.
    await expect(deleteDocument(key)).resolves.toBeUndefined();
  });

  it('stores a stream of several chunks byte-identical (no aws-chunked framing in the object)', async () => {
    const key = 'documents/harrow-sound/camera-housing-4000m.pdf';
    const parts = [randomBytes(70_000), randomBytes(1), randomBytes(65_536), randomBytes(12_345)];
    const body = Buffer.concat(parts);
    await putDocument({ key, body: Readable.from(parts), contentType: 'application/pdf', contentLength: body.length });
    const stored = await getDocument(key);
    const back = await readAll(stored.stream);
    expect(back.length).toBe(body.length);
    expect(back.equals(body)).toBe(true);
    await deleteDocument(key);
  });

  // Reproduces finding 7 of the account-safety assessment: a failed upload left a truncated object.
  it('leaves no partial object when the body breaks off half way through a put', async () => {
    const key = 'documents/harrow-sound/broken-off-upload.pdf';
    const first = randomBytes(300_000);
    let sent = false;
    const body = new Readable({
      read() {
        if (!sent) {
          sent = true;
          this.push(first);
        } else {
          // The source (a client, a disk) fails after the first 300 kB of a declared 1 MB.
          setTimeout(() => this.destroy(new Error('source broke off')), 50);
        }
      },
    });
    body.on('error', () => undefined); // the SDK sees it through the request it aborts
    const log = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    const started = Date.now();
    await expect(putDocument({ key, body, contentType: 'application/pdf', contentLength: 1_000_000 })).rejects.toBeInstanceOf(StorageError);
    // It fails at once instead of waiting for the missing bytes until a timeout (30 s before).
    expect(Date.now() - started).toBeLessThan(10_000);
    expect(log).toHaveBeenCalled();
    expect(await documentExists(key)).toBe(false);
    const files = await filesUnder(dataDir);
    const contents = await Promise.all(files.map((f) => readFile(f)));
    // Nor is any file of the fake holding the bytes that arrived.
    expect(contents.some((c) => c.length > 0 && first.subarray(0, 1024).equals(c.subarray(0, 1024)))).toBe(false);
  }, 20_000);

  it('replaces an object put twice under one key', async () => {
    const key = 'documents/replace-me.pdf';
    await putDocument({ key, body: Buffer.from('first'), contentType: 'text/plain' });
    await putDocument({ key, body: Buffer.from('second version'), contentType: 'text/plain' });
    expect((await readAll((await getDocument(key)).stream)).toString()).toBe('second version');
    await deleteDocument(key);
  });

  it('refuses a stream without its length, and a length that contradicts the buffer', async () => {
    await expect(
      putDocument({ key: 'documents/x.pdf', body: Readable.from([Buffer.from('abc')]), contentType: 'application/pdf' }),
    ).rejects.toBeInstanceOf(TypeError);
    await expect(
      putDocument({ key: 'documents/x.pdf', body: Buffer.from('abc'), contentType: 'application/pdf', contentLength: 4 }),
    ).rejects.toBeInstanceOf(TypeError);
    expect(await documentExists('documents/x.pdf')).toBe(false);
  });

  it.each([['../outside.pdf'], ['/absolute.pdf'], ['documents//double.pdf'], ['documents/./here.pdf'], ['trailing/'], ['with space.pdf'], ['back\\slash.pdf'], ['']])(
    'refuses the key %j before asking the store',
    async (key) => {
      await expect(putDocument({ key, body: Buffer.from('x'), contentType: 'text/plain' })).rejects.toBeInstanceOf(InvalidDocumentKeyError);
      await expect(getDocument(key)).rejects.toMatchObject({ status: 400, code: 'invalid_document_key' });
      await expect(documentExists(key)).rejects.toBeInstanceOf(InvalidDocumentKeyError);
      await expect(deleteDocument(key)).rejects.toBeInstanceOf(InvalidDocumentKeyError);
    },
  );

  it('creates a missing bucket once and reports the second call as already there', async () => {
    const bucket = 'isobath-ensure-test';
    useEnv({ S3_BUCKET: bucket });
    try {
      expect(await ensureBucket()).toBe(true);
      expect(await ensureBucket()).toBe(false);
      await putDocument({ key: 'probe.txt', body: Buffer.from('probe'), contentType: 'text/plain' });
      expect(await documentExists('probe.txt')).toBe(true);
      expect((await readdir(dataDir)).includes(bucket)).toBe(true);
    } finally {
      useEnv({ S3_BUCKET: BUCKET });
    }
  });

  it('reports a store that refuses the credentials as storage_failed (502), not as a missing document', async () => {
    useEnv({ S3_ACCESS_KEY_ID: 'NOT-THE-FAKES-KEY', S3_SECRET_ACCESS_KEY: 'whatever' });
    const log = vi.spyOn(console, 'error').mockImplementation(() => {});
    try {
      await expect(getDocument('documents/anything.pdf')).rejects.toMatchObject({ status: 502, code: 'storage_failed' });
      expect(log).toHaveBeenCalled();
    } finally {
      useEnv({ S3_ACCESS_KEY_ID: undefined, S3_SECRET_ACCESS_KEY: undefined });
    }
  });

  it('reports an unreachable store as storage_unavailable (503)', async () => {
    useEnv({ S3_ENDPOINT: `http://127.0.0.1:${await closedPort()}` });
    const log = vi.spyOn(console, 'error').mockImplementation(() => {});
    try {
      const failure = putDocument({ key: 'documents/nowhere.pdf', body: Buffer.from('x'), contentType: 'text/plain' });
      await expect(failure).rejects.toBeInstanceOf(StorageError);
      await expect(documentExists('documents/nowhere.pdf')).rejects.toMatchObject({ status: 503, code: 'storage_unavailable' });
      expect(log).toHaveBeenCalled();
    } finally {
      useEnv({ S3_ENDPOINT: fake.endpoint });
    }
  });
});

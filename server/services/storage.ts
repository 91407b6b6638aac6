// Document storage on an S3-compatible object store. The same code talks to the local fake
// (scripts/fakes/s3.ts) and to a real store: only S3_* variables change.
import { createHash } from 'node:crypto';
import { Readable } from 'node:stream';
import {
  CreateBucketCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  HeadObjectCommand,
  PutObjectCommand,
  S3Client,
  type BucketLocationConstraint,
} from '@aws-sdk/client-s3';
import { env } from '../config/env';
import { AppError, OutsideServiceError } from '../errors';

/** The stored object asked for is not in the bucket. */
export class DocumentNotFoundError extends AppError {
  constructor(readonly key: string) {
    super(404, 'not_found', 'The document was not found.');
    this.name = 'DocumentNotFoundError';
  }
}

/** A key that could escape its prefix or that the store would mangle. */
export class InvalidDocumentKeyError extends AppError {
  constructor(
    readonly key: string,
    reason: string,
  ) {
    super(400, 'invalid_document_key', `The document key is not valid: ${reason}.`);
    this.name = 'InvalidDocumentKeyError';
  }
}

/** The object store could not be reached (503) or refused the request (502). Logged where raised. */
export class StorageError extends OutsideServiceError<'storage_unavailable' | 'storage_failed'> {
  override name = 'StorageError';
}

export interface PutDocumentInput {
  key: string;
  body: Buffer | Readable;
  contentType: string;
  /** Required for a stream (the store needs the length up front); checked against a Buffer's length. */
  contentLength?: number;
}

export interface StoredDocument {
  /** Consume or destroy it: an unread body keeps a connection to the store busy. */
  stream: Readable;
  contentType: string;
  /** From the store's Content-Length; undefined only if the store sent none. */
  contentLength: number | undefined;
}

// Object key naming guidelines (AWS S3 User Guide, "Naming Amazon S3 objects"): keys are up to
// 1,024 bytes; the "safe characters" are letters, digits and ! - _ . * ' ( ) plus / as a
// delimiter. Isobath keeps to a stricter subset so a key is also a safe file path in the fake.
const KEY_SEGMENT = /^[A-Za-z0-9._-]+$/;
const MAX_KEY_BYTES = 1024;

/** Throws InvalidDocumentKeyError unless the key is slash-separated safe segments with no . or .. segment. */
export function assertDocumentKey(key: string): void {
  if (typeof key !== 'string' || key.length === 0) throw new InvalidDocumentKeyError(String(key), 'it is empty');
  if (Buffer.byteLength(key, 'utf8') > MAX_KEY_BYTES) throw new InvalidDocumentKeyError(key, 'it is longer than 1024 bytes');
  for (const segment of key.split('/')) {
    if (segment === '') throw new InvalidDocumentKeyError(key, 'it has an empty path segment or a leading or trailing slash');
    if (segment === '.' || segment === '..') throw new InvalidDocumentKeyError(key, 'it has a . or .. segment');
    if (!KEY_SEGMENT.test(segment)) throw new InvalidDocumentKeyError(key, 'use only letters, digits, dot, dash, underscore and /');
  }
}

let client: S3Client | undefined;

/** The process's one S3 client, created on first use from S3_* variables. */
export function storageClient(): S3Client {
  if (client) return client;
  const e = env();
  client = new S3Client({
    region: e.S3_REGION,
    ...(e.S3_ENDPOINT ? { endpoint: e.S3_ENDPOINT } : {}),
    forcePathStyle: e.S3_FORCE_PATH_STYLE,
    // Unset keys (production only) leave the SDK's own credential chain in charge.
    ...(e.S3_ACCESS_KEY_ID && e.S3_SECRET_ACCESS_KEY
      ? { credentials: { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY } }
      : {}),
    // The SDK's default (WHEN_SUPPORTED) sends streamed bodies as aws-chunked with a CRC
    // trailer; s3rver and several self-hosted stores save that framing as the object's bytes.
    // Buffers get a Content-MD5 instead (see putDocument), which every S3 store checks.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    requestHandler: { connectionTimeout: 5_000, requestTimeout: 60_000 },
    maxAttempts: 3,
  });
  return client;
}

/** Drops the client (and its sockets). For shutdown and for tests that change S3_* variables. */
export function closeStorage(): void {
  client?.destroy();
  client = undefined;
}

function bucket(): string {
  return env().S3_BUCKET;
}

function httpStatus(err: unknown): number | undefined {
  return (err as { $metadata?: { httpStatusCode?: number } } | undefined)?.$metadata?.httpStatusCode;
}

function errorName(err: unknown): string {
  return String((err as { name?: string; Code?: string } | undefined)?.name ?? '');
}

/** Turns an SDK or network error into a typed error; logs the ones that are the store's fault. */
function storageFailure(err: unknown, action: string, key?: string): AppError {
  if (err instanceof AppError) return err;
  const status = httpStatus(err);
  const name = errorName(err);
  if (key !== undefined && name !== 'NoSuchBucket' && (name === 'NoSuchKey' || name === 'NotFound' || status === 404)) {
    return new DocumentNotFoundError(key);
  }
  const where = key === undefined ? `bucket ${bucket()}` : `${bucket()}/${key}`;
  console.error(`[isobath] storage: ${action} ${where} failed:`, err instanceof Error ? `${err.name}: ${err.message}` : err);
  if (status === undefined || status >= 500 || name === 'TimeoutError') {
    return new StorageError(503, 'storage_unavailable', 'The document store is unavailable. Try again in a moment.', err);
  }
  return new StorageError(502, 'storage_failed', 'The document store refused the request.', err);
}

function assertContentType(contentType: string): void {
  if (typeof contentType !== 'string' || !/^[\x21-\x7e][\x20-\x7e]*$/.test(contentType)) {
    throw new TypeError('contentType must be a non-empty printable ASCII media type');
  }
}

/** Stores a document under `key`, replacing any object already there. */
export async function putDocument(input: PutDocumentInput): Promise<{ key: string; size: number }> {
  const { key, body, contentType, contentLength } = input;
  assertDocumentKey(key);
  assertContentType(contentType);
  let size: number;
  let contentMD5: string | undefined;
  if (Buffer.isBuffer(body)) {
    if (contentLength !== undefined && contentLength !== body.length) {
      throw new TypeError(`contentLength ${contentLength} does not match the buffer's ${body.length} bytes`);
    }
    size = body.length;
    // RFC 1864 Content-MD5: the store rejects the upload (BadDigest) if the bytes changed on the way.
    contentMD5 = createHash('md5').update(body).digest('base64');
  } else if (body instanceof Readable) {
    if (contentLength === undefined || !Number.isSafeInteger(contentLength) || contentLength < 0) {
      throw new TypeError('contentLength (a whole number of bytes) is required when body is a stream');
    }
    size = contentLength;
  } else {
    throw new TypeError('body must be a Buffer or a Readable stream');
  }
  // A stream that breaks off ends the request at once (the SDK would otherwise wait for the
  // missing bytes until a timeout).
  const abort = new AbortController();
  if (body instanceof Readable) body.once('error', (err) => abort.abort(err));
  try {
    await storageClient().send(
      new PutObjectCommand({
        Bucket: bucket(),
        Key: key,
        Body: body,
        ContentType: contentType,
        ContentLength: size,
        ...(contentMD5 ? { ContentMD5: contentMD5 } : {}),
      }),
      { abortSignal: abort.signal },
    );
  } catch (err) {
    const failure = storageFailure(err, 'put', key);
    // A put cut off half way may leave the bytes that arrived under the key (some stores keep
    // them, the local fake among them): remove them, so a failed upload leaves nothing behind.
    await removePartial(key);
    throw failure;
  }
  return { key, size };
}

async function removePartial(key: string): Promise<void> {
  try {
    await storageClient().send(new DeleteObjectCommand({ Bucket: bucket(), Key: key }));
  } catch (err) {
    console.error(`[isobath] storage: could not remove what a failed put left under ${bucket()}/${key}:`, err instanceof Error ? `${err.name}: ${err.message}` : err);
  }
}

/** One request to the store about a document: the key checked first, a failure as storageFailure words it. */
async function onDocument<T>(action: string, key: string, request: (client: S3Client) => Promise<T>): Promise<T> {
  assertDocumentKey(key);
  try {
    return await request(storageClient());
  } catch (err) {
    throw storageFailure(err, action, key);
  }
}

/** Opens a stored document for reading. Throws DocumentNotFoundError when it is not there. */
export async function getDocument(key: string): Promise<StoredDocument> {
  return onDocument('get', key, async (client) => {
    const out = await client.send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
    if (!(out.Body instanceof Readable)) throw new Error('the store returned no readable body');
    return {
      stream: out.Body,
      contentType: out.ContentType ?? 'application/octet-stream',
      contentLength: out.ContentLength,
    };
  });
}

/** Deletes a stored document. Idempotent: deleting a missing key succeeds, as in S3 itself. */
export async function deleteDocument(key: string): Promise<void> {
  await onDocument('delete', key, (client) => client.send(new DeleteObjectCommand({ Bucket: bucket(), Key: key })));
}

/** True when an object is stored under `key`. */
export async function documentExists(key: string): Promise<boolean> {
  try {
    await onDocument('head', key, (client) => client.send(new HeadObjectCommand({ Bucket: bucket(), Key: key })));
    return true;
  } catch (err) {
    if (err instanceof DocumentNotFoundError) return false;
    throw err;
  }
}

/**
 * Creates S3_BUCKET when it does not exist (the local fake, a fresh self-hosted store).
 * Returns true when it created the bucket. On a managed store, create the bucket with its
 * policies beforehand: this is only a convenience.
 */
export async function ensureBucket(): Promise<boolean> {
  const s3 = storageClient();
  const Bucket = bucket();
  try {
    await s3.send(new HeadBucketCommand({ Bucket }));
    return false;
  } catch (err) {
    if (httpStatus(err) !== 404) throw storageFailure(err, 'check');
  }
  const region = env().S3_REGION;
  try {
    // AWS S3 API reference, CreateBucket: us-east-1 takes no LocationConstraint; other regions need one.
    await s3.send(
      new CreateBucketCommand({
        Bucket,
        ...(region === 'us-east-1' ? {} : { CreateBucketConfiguration: { LocationConstraint: region as BucketLocationConstraint } }),
      }),
    );
    return true;
  } catch (err) {
    const name = errorName(err);
    // Created by someone else in between (another process starting at the same time).
    if (name === 'BucketAlreadyOwnedByYou' || name === 'BucketAlreadyExists') {
      try {
        await s3.send(new HeadBucketCommand({ Bucket }));
        return false;
      } catch (again) {
        throw storageFailure(again, 'check');
      }
    }
    throw storageFailure(err, 'create');
  }
}

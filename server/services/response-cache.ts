import { gzip } from 'node:zlib';
import { promisify } from 'node:util';
import type { Request, Response } from 'express';
import { LRUCache } from 'lru-cache';
import { cachesUsable } from './change-feed';

/** A serialized JSON answer, with its gzip form made once on first demand. */
const gzipAsync = promisify(gzip);

export class CachedBody {
  private gz: Promise<Buffer> | undefined;
  private raw: Buffer | undefined;
  constructor(readonly json: string) {}
  /** The UTF-8 bytes, encoded once. */
  bytes(): Buffer {
    this.raw ??= Buffer.from(this.json, 'utf8');
    return this.raw;
  }
  /** The gzip form, made once, off the event loop (zlib's thread pool). */
  gzip(): Promise<Buffer> {
    this.gz ??= gzipAsync(this.bytes(), { level: 6 });
    return this.gz;
  }
}

/**
 * A bounded cache of serialized JSON answers (least recently used out first). Callers put the
 * catalogue generation in the key, so a publish, edit or retire makes old answers unreachable.
 */
export function jsonResponseCache(maxBytes: number): LRUCache<string, CachedBody> {
  // Size: the string, its bytes and a gzip form (about a tenth) of each answer.
  return new LRUCache<string, CachedBody>({ maxSize: maxBytes, sizeCalculation: (body) => Math.max(1, Math.ceil(body.json.length * 3.2)) });
}

/**
 * The cached answer under `key`, or a new one built by `build` and kept. While the change feed is
 * not listening (a change may have gone unheard) answers are built afresh and not kept.
 */
export async function cachedJson(cache: LRUCache<string, CachedBody>, key: string, build: () => unknown | Promise<unknown>): Promise<CachedBody> {
  if (!cachesUsable()) {
    cache.clear();
    return new CachedBody(JSON.stringify(await build()));
  }
  let body = cache.get(key);
  if (body === undefined) {
    body = new CachedBody(JSON.stringify(await build()));
    // Kept only if the feed stayed up while it was built (the key holds the catalogue generation).
    if (cachesUsable()) cache.set(key, body);
  }
  return body;
}

/** Sends a cached answer, compressed once and reused when the client accepts gzip. */
export async function sendCached(req: Request, res: Response, body: CachedBody): Promise<void> {
  res.type('application/json');
  res.vary('Accept-Encoding');
  if (body.json.length > 1024 && req.acceptsEncodings('gzip', 'identity') === 'gzip') {
    const gz = await body.gzip();
    res.setHeader('Content-Encoding', 'gzip');
    res.send(gz);
    return;
  }
  res.send(body.bytes());
}

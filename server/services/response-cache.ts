import { createHash } from 'node:crypto';
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
  /** `transient`: sent once and not kept, so compressed fast (level 1) rather than small (level 6). */
  constructor(
    readonly json: string,
    private transient = false,
  ) {}
  /** The UTF-8 bytes, encoded once. */
  bytes(): Buffer {
    this.raw ??= Buffer.from(this.json, 'utf8');
    return this.raw;
  }
  /** The gzip form, made once, off the event loop (zlib's thread pool). */
  gzip(): Promise<Buffer> {
    this.gz ??= gzipAsync(this.bytes(), { level: this.transient ? 1 : 6 });
    return this.gz;
  }
}

/** A bounded cache of serialized JSON answers, and the keys asked for once (see cachedJson). */
export interface JsonResponseCache {
  readonly answers: LRUCache<string, CachedBody>;
  /** Keys asked for once and not kept yet (only with `keepOnSecondRequest`). */
  readonly seenOnce: LRUCache<string, true> | null;
}

/**
 * A bounded cache of serialized JSON answers (least recently used out first). Callers put the
 * catalogue generation in the key, so a publish, edit or retire makes old answers unreachable.
 * With `keepOnSecondRequest`, an answer is kept only when its key is asked for a second time
 * (a reload, a ranking switch, a shared link): a one-off load case — most new evaluations — then
 * costs no copy into the cache and does not push out answers that are asked for again.
 */
export function jsonResponseCache(maxBytes: number, options: { keepOnSecondRequest?: boolean } = {}): JsonResponseCache {
  return {
    // Size: the string, its bytes and a gzip form (about a tenth) of each answer.
    answers: new LRUCache<string, CachedBody>({ maxSize: maxBytes, sizeCalculation: (body) => Math.max(1, Math.ceil(body.json.length * 3.2)) }),
    seenOnce: options.keepOnSecondRequest ? new LRUCache<string, true>({ max: 20_000 }) : null,
  };
}

/**
 * The cached answer under `key`, or a new one built by `build` and kept (with
 * `keepOnSecondRequest`, kept the second time the key is asked for). While the change feed is
 * not listening (a change may have gone unheard) answers are built afresh and not kept.
 */
export async function cachedJson(cache: JsonResponseCache, key: string, build: () => unknown | Promise<unknown>): Promise<CachedBody> {
  const { answers, seenOnce } = cache;
  if (!cachesUsable()) {
    answers.clear();
    seenOnce?.clear();
    return new CachedBody(JSON.stringify(await build()), true);
  }
  const hit = answers.get(key);
  if (hit !== undefined) return hit;
  const json = JSON.stringify(await build());
  // Kept only if the feed stayed up while it was built (the key holds the catalogue generation).
  if (!cachesUsable()) return new CachedBody(json, true);
  if (seenOnce) {
    // Remembered by a digest: a request key is long (the whole load case) and most are asked once.
    const seen = createHash('sha1').update(key).digest('base64');
    if (!seenOnce.has(seen)) {
      seenOnce.set(seen, true);
      return new CachedBody(json, true);
    }
    seenOnce.delete(seen);
  }
  const body = new CachedBody(json);
  answers.set(key, body);
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

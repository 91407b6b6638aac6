import { LRUCache } from 'lru-cache';

/**
 * A bounded cache of serialized JSON answers (least recently used out first). Callers put the
 * catalogue generation in the key, so a publish, edit or retire makes old answers unreachable.
 */
export function jsonResponseCache(maxBytes: number): LRUCache<string, string> {
  return new LRUCache<string, string>({ maxSize: maxBytes, sizeCalculation: (value) => Math.max(1, value.length) });
}

import { gunzipSync } from 'node:zlib';
import { beforeEach, describe, expect, it, vi } from 'vitest';

let listening = true;
vi.mock('./change-feed', () => ({ cachesUsable: () => listening }));
const { cachedJson, jsonResponseCache } = await import('./response-cache');

describe('the answer cache', () => {
  beforeEach(() => {
    listening = true;
  });

  it('keeps every answer from the first request by default', async () => {
    const cache = jsonResponseCache(2 ** 20);
    let built = 0;
    const build = () => ({ n: ++built });
    expect((await cachedJson(cache, 'a', build)).json).toBe('{"n":1}');
    expect((await cachedJson(cache, 'a', build)).json).toBe('{"n":1}');
    expect(built).toBe(1);
  });

  it('with keepOnSecondRequest keeps an answer only once its key is asked for again', async () => {
    const cache = jsonResponseCache(2 ** 20, { keepOnSecondRequest: true });
    let built = 0;
    const build = () => ({ n: ++built });
    expect((await cachedJson(cache, 'load case 1', build)).json).toBe('{"n":1}');
    expect(cache.answers.size).toBe(0);
    // Asked again: built again (nothing was kept) and now kept.
    expect((await cachedJson(cache, 'load case 1', build)).json).toBe('{"n":2}');
    expect(cache.answers.size).toBe(1);
    expect((await cachedJson(cache, 'load case 1', build)).json).toBe('{"n":2}');
    expect(built).toBe(2);
    // Another key starts over.
    await cachedJson(cache, 'load case 2', build);
    expect(cache.answers.has('load case 2')).toBe(false);
  });

  it('keeps nothing while the change feed is not listening, and forgets what it had', async () => {
    const cache = jsonResponseCache(2 ** 20, { keepOnSecondRequest: true });
    let built = 0;
    const build = () => ({ n: ++built });
    await cachedJson(cache, 'k', build);
    await cachedJson(cache, 'k', build);
    expect(cache.answers.size).toBe(1);
    listening = false;
    expect((await cachedJson(cache, 'k', build)).json).toBe('{"n":3}');
    expect(cache.answers.size).toBe(0);
    expect(cache.seenOnce!.size).toBe(0);
    listening = true;
    // The feed was down: the key counts as new.
    await cachedJson(cache, 'k', build);
    expect(cache.answers.size).toBe(0);
  });

  it('sends the same bytes gzipped whether an answer was kept or sent once', async () => {
    const cache = jsonResponseCache(2 ** 20, { keepOnSecondRequest: true });
    const big = { rows: Array.from({ length: 400 }, (_, i) => ({ i, text: 'a governing mode and its model' })) };
    const once = await cachedJson(cache, 'x', () => big);
    const kept = await cachedJson(cache, 'x', () => big);
    expect(cache.answers.get('x')).toBe(kept);
    for (const body of [once, kept]) expect(gunzipSync(await body.gzip()).toString('utf8')).toBe(JSON.stringify(big));
  });
});

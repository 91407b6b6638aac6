// POST /api/evaluate is limited per account (EVALUATE_RATE_LIMIT a minute over all workers): a
// looping caller gets 429 with Retry-After and a clear message, another account is not held up.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { resetEnvCache } from '../../server/config/env';
import { signIn, startTestApp } from '../helpers/app';
import { DEMO_CHAMBER_PORT } from '../../shared/demo-load-cases';

let handle: Awaited<ReturnType<typeof startTestApp>>;
const saved = { limit: process.env.EVALUATE_RATE_LIMIT, workers: process.env.WEB_CONCURRENCY };

beforeAll(async () => {
  process.env.EVALUATE_RATE_LIMIT = '6';
  process.env.WEB_CONCURRENCY = '1';
  resetEnvCache();
  handle = await startTestApp();
});
afterAll(async () => {
  await handle.stop();
  process.env.EVALUATE_RATE_LIMIT = saved.limit;
  if (saved.workers === undefined) delete process.env.WEB_CONCURRENCY;
  else process.env.WEB_CONCURRENCY = saved.workers;
  resetEnvCache();
});

describe('evaluation limit', () => {
  it('answers 429 with Retry-After to the seventh evaluation in a minute, and only for that account', async () => {
    const engineer = await signIn(handle.app, 'engineer');
    const checker = await signIn(handle.app, 'checker');
    const statuses: number[] = [];
    for (let i = 0; i < 7; i++) statuses.push((await engineer.post('/api/evaluate').send({ loadCase: { ...DEMO_CHAMBER_PORT, pressure: { value: 0.5e6 + i } } })).status);
    expect(statuses).toEqual([200, 200, 200, 200, 200, 200, 429]);
    const refused = await engineer.post('/api/evaluate').send({ loadCase: DEMO_CHAMBER_PORT });
    expect(refused.status).toBe(429);
    expect(refused.body.error).toMatchObject({ code: 'too_many_requests' });
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
    expect((await checker.post('/api/evaluate').send({ loadCase: DEMO_CHAMBER_PORT })).status).toBe(200);
    // Reading the catalogue is not limited by it.
    expect((await engineer.get('/api/property-sets')).status).toBe(200);
  });
});

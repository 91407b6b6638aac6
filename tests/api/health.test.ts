import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestApp } from '../helpers/app';

let handle: Awaited<ReturnType<typeof startTestApp>>;
beforeAll(async () => {
  handle = await startTestApp();
});
afterAll(async () => {
  await handle.stop();
});

describe('GET /api/health', () => {
  it('answers 200 after a database round trip', async () => {
    const res = await request(handle.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', database: 'ok' });
  });

  it('sends security headers, including a content security policy without inline scripts', async () => {
    const res = await request(handle.app).get('/api/health');
    const csp = String(res.headers['content-security-policy']);
    expect(csp).toContain("script-src 'self'");
    expect(csp).not.toContain('unsafe-inline');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('returns a JSON 404 for an unknown API route once signed out, as 401', async () => {
    const res = await request(handle.app).get('/api/no-such-thing');
    expect(res.status).toBe(401);
  });
});

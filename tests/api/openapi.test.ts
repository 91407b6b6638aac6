import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Validator } from '@seriousme/openapi-schema-validator';
import { startTestApp } from '../helpers/app';
import { apiRoutes } from '../../server/openapi/route-table';
import { OPERATIONS } from '../../server/openapi/operations';

let handle: Awaited<ReturnType<typeof startTestApp>>;
beforeAll(async () => {
  handle = await startTestApp();
});
afterAll(async () => {
  await handle.stop();
});

describe('GET /api/openapi.json', () => {
  it('is public and a valid OpenAPI 3.1 document (checked with the OpenAPI JSON Schemas)', async () => {
    const res = await request(handle.app).get('/api/openapi.json');
    expect(res.status).toBe(200);
    expect(res.body.openapi).toBe('3.1.0');
    const result = await new Validator().validate(res.body);
    expect(result.errors ?? []).toEqual([]);
    expect(result.valid).toBe(true);
  });

  it('describes every mounted route, each with its guard, and nothing that is not mounted', async () => {
    const routes = apiRoutes(handle.app);
    const keys = routes.map((r) => `${r.method.toUpperCase()} ${r.path}`);
    expect(new Set(keys).size).toBe(keys.length);
    expect(routes.filter((r) => r.access === null)).toEqual([]);
    expect(keys.filter((k) => !OPERATIONS[k])).toEqual([]);
    expect(Object.keys(OPERATIONS).filter((k) => !keys.includes(k))).toEqual([]);

    const doc = (await request(handle.app).get('/api/openapi.json')).body;
    const documented = Object.entries(doc.paths as Record<string, Record<string, { 'x-isobath-access': string }>>).flatMap(([path, ops]) =>
      Object.entries(ops).map(([method, op]) => ({ key: `${method.toUpperCase()} ${path}`, access: op['x-isobath-access'] })),
    );
    expect(documented).toHaveLength(routes.length);
    expect(documented.find((d) => d.key === 'POST /api/evaluate')?.access).toBe('evaluate');
    expect(documented.find((d) => d.key === 'POST /api/shortlists/{id}/check')?.access).toBe('shortlist:check');
    expect(documented.find((d) => d.key === 'POST /api/auth/login')?.access).toBe('public');
  });

  it('carries the request schemas generated from the shared zod schemas', async () => {
    const doc = (await request(handle.app).get('/api/openapi.json')).body;
    const evaluate = doc.paths['/api/evaluate'].post.requestBody.content['application/json'].schema;
    expect(evaluate.properties.loadCase).toBeTruthy();
    expect(evaluate.required).toContain('loadCase');
    expect(evaluate.additionalProperties).toBe(false);
    const upload = doc.paths['/api/references/{id}/document'].post.requestBody.content['multipart/form-data'];
    expect(upload.schema.properties.file.format).toBe('binary');
  });
});

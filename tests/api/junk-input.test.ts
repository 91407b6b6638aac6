/**
 * Property-based junk: random and hostile bodies, query strings and path parameters sent to every
 * operation of the OpenAPI document. Never a 5xx, always a clear error body for a 4xx, nothing
 * internal in any answer, and the database exactly as it was (row counts and checksums).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import request from 'supertest';
import { startTestApp } from '../helpers/app';
import { sequelize } from '../../server/db/sequelize';
import { TABLES } from '../../server/db/setup';

let handle: Awaited<ReturnType<typeof startTestApp>>;
let operations: { method: 'get' | 'post' | 'put' | 'patch' | 'delete'; path: string }[] = [];
// Sessions are left out: signing in to send the junk creates them.
const CHECKED = TABLES.filter((t) => t !== 'session');

/** Row count and an order-independent checksum of every row, per table. */
async function fingerprint(): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  for (const t of CHECKED) {
    // Signing in (to send the junk) stamps users.last_login_at; everything else must stay put.
    const row = t === 'users' ? '(x.id, x.email, x.name, x.role, x.password_hash, x.active)' : 'x';
    const [rows] = await sequelize().query(`SELECT count(*)::text AS n, coalesce(sum(hashtext(${row}::text)::bigint), 0)::text AS h FROM ${t} x`);
    const r = (rows as { n: string; h: string }[])[0];
    out[t] = `${r.n}:${r.h}`;
  }
  return out;
}

const hostileString = fc.oneof(
  fc.string({ maxLength: 40 }),
  fc.constantFrom(
    "' OR 1=1; DROP TABLE users; --",
    '<script>alert(1)</script>',
    '"><img src=x onerror=alert(1)>',
    '__proto__',
    'constructor',
    '\u0000\u0001\u0002',
    '\uD800',
    '../../../../etc/passwd',
    '%00',
    '1e999',
    '-0',
    'NaN',
    'Infinity',
    '9'.repeat(400),
    'x'.repeat(20_000),
    '{"$gt":""}',
    '${7*7}',
  ),
);
const hostileValue: fc.Arbitrary<unknown> = fc.letrec((tie) => ({
  value: fc.oneof(
    { depthSize: 'small' },
    hostileString,
    fc.double(),
    fc.integer(),
    fc.boolean(),
    fc.constant(null),
    fc.constantFrom(1e308, -1e308, Number.MAX_SAFE_INTEGER + 2, -1),
    fc.array(tie('value'), { maxLength: 4 }),
    fc.dictionary(hostileString, tie('value'), { maxKeys: 4 }),
  ),
})).value;
const pollutedObject = fc.constantFrom(
  '{"__proto__":{"admin":true},"name":"x"}',
  '{"constructor":{"prototype":{"role":"admin"}}}',
  JSON.stringify({ loadCase: { component: { type: 'flat-disc', diameter: 'NaN' } } }),
  '['.repeat(5000) + ']'.repeat(5000),
  '{"a":'.repeat(3000) + '1' + '}'.repeat(3000),
  '{"name":"\\u0000"}',
  '{"email":"engineer@harrow.example","password":{"$ne":null}}',
);
const hostileParam = fc.oneof(
  fc.constantFrom('0', '-1', '1.5', '1e999', 'NaN', '99999999999999999999', '%00', '..%2F..%2Fetc', "1' OR '1'='1", '<x>', '%E0%A4%A', ' ', '💥'),
  fc.string({ minLength: 1, maxLength: 12 }).map(encodeURIComponent),
);
const hostileQuery = fc.dictionary(fc.constantFrom('family', 'q', 'limit', 'offset', 'tmin', 'tmax', 'status', 'depth', 'latitude', 'water', 'entityType', 'mine', '__proto__', 'x'), fc.oneof(hostileString, hostileString.map((s) => [s, s])), { maxKeys: 4 });

beforeAll(async () => {
  handle = await startTestApp();
  const doc = (await request(handle.app).get('/api/openapi.json')).body as { paths: Record<string, Record<string, unknown>> };
  operations = Object.entries(doc.paths).flatMap(([path, ops]) => Object.keys(ops).map((method) => ({ method: method as 'get', path })));
}, 60_000);
afterAll(async () => {
  await handle.stop();
});

async function adminCookie(): Promise<string> {
  const res = await request(handle.app).post('/api/auth/login').send({ email: 'admin@harrow.example', password: 'harrow-demo-2026' });
  return String(res.headers['set-cookie']).split(';')[0];
}

function checkAnswer(status: number, body: unknown, text: string, what: string) {
  expect(status, what).toBeLessThan(500);
  expect(text, what).not.toMatch(/\n\s+at [\w.<>]+ \(|SequelizeDatabaseError|syntax error at or near|node_modules/);
  if (status >= 400) {
    const err = (body as { error?: { code?: unknown; message?: unknown } })?.error;
    expect(typeof err?.code, what).toBe('string');
    expect(typeof err?.message, what).toBe('string');
  }
}

describe('junk input on every operation', () => {
  it('never answers 5xx, never leaks internals, and changes nothing', async () => {
    expect(operations.length).toBeGreaterThan(50);
    const cookie = await adminCookie();
    const before = await fingerprint();
    for (const op of operations) {
      // Logging out would end the session the rest of the run uses.
      const sessionCookie = op.path === '/api/auth/logout' ? await adminCookie() : cookie;
      await fc.assert(
        fc.asyncProperty(hostileParam, hostileQuery, fc.oneof(hostileValue.map((v) => JSON.stringify(v) ?? 'null'), pollutedObject), async (param, query, body) => {
          const path = op.path.replace(/\{[A-Za-z]+\}/g, param);
          const qs = new URLSearchParams();
          for (const [k, v] of Object.entries(query)) for (const one of [v].flat()) qs.append(k, String(one));
          let req = request(handle.app)[op.method](`${path}${qs.size ? `?${qs}` : ''}`).set('Cookie', sessionCookie);
          if (op.method !== 'get' && op.method !== 'delete') req = req.set('Content-Type', 'application/json').send(body);
          const res = await req;
          checkAnswer(res.status, res.body, res.text ?? '', `${op.method.toUpperCase()} ${path}`);
          // Nothing sent here is a valid write, so nothing may succeed in creating anything.
          if (op.method !== 'get' && res.status < 300) {
            expect(['/api/auth/logout', '/api/auth/password-reset/request'], `${op.method} ${path} accepted junk`).toContain(op.path);
          }
        }),
        { numRuns: 12, seed: 20261201 },
      );
    }
    expect(await fingerprint()).toEqual(before);
  }, 300_000);

  it('refuses a body over the size limit with 413, and invalid UTF-8 and bad JSON with 400', async () => {
    const cookie = await adminCookie();
    const big = await request(handle.app).post('/api/evaluate').set('Cookie', cookie).set('Content-Type', 'application/json').send(`{"x":"${'y'.repeat(1_100_000)}"}`);
    expect(big.status).toBe(413);
    const bad = await request(handle.app).post('/api/evaluate').set('Cookie', cookie).set('Content-Type', 'application/json').send(Buffer.from([0x7b, 0x22, 0xff, 0xfe, 0x22, 0x3a, 0x31, 0x7d]));
    expect(bad.status).toBe(400);
    const broken = await request(handle.app).post('/api/projects').set('Cookie', cookie).set('Content-Type', 'application/json').send('{"name": ');
    expect(broken.status).toBe(400);
    expect(broken.body.error.code).toBe('invalid_json');
  });

  it('refuses text with NUL characters instead of storing it', async () => {
    const cookie = await adminCookie();
    const res = await request(handle.app).post('/api/projects').set('Cookie', cookie).send({ name: 'HS-2\u0000viewports' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain('name');
  });
});

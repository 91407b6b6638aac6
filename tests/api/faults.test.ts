/**
 * Faults: the database stops and starts under a running app; the app restarts; the process is
 * told to stop while a request is still arriving. Uses a PostgreSQL cluster of its own.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startServerProcess } from '../helpers/server-process';
import http from 'node:http';
import { startCluster, type Cluster } from '../helpers/pg-cluster';
import { resetEnvCache } from '../../server/config/env';
import { closeDatabase } from '../../server/db/sequelize';
import { resetDatabase } from '../../server/db/setup';
import { createApp, type AppHandle } from '../../server/app';
import { forgetAllSessions } from '../../server/auth/session-cache';
import { forgetSessionUsers } from '../../server/auth/passport';
import { DEMO_PASSWORD } from '../../server/db/seeders/demo';

let cluster: Cluster;
let handle: AppHandle;
const savedUrl = process.env.DATABASE_URL;

beforeAll(async () => {
  cluster = await startCluster();
  process.env.DATABASE_URL = cluster.url;
  resetEnvCache();
  await closeDatabase();
  await resetDatabase();
  handle = createApp();
}, 120_000);

afterAll(async () => {
  await handle?.close();
  await closeDatabase();
  cluster?.destroy();
  process.env.DATABASE_URL = savedUrl;
  resetEnvCache();
});

const signIn = async (app: AppHandle['app'], role: string) => {
  const res = await request(app).post('/api/auth/login').send({ email: `${role}@harrow.example`, password: DEMO_PASSWORD });
  expect(res.status).toBe(200);
  return String(res.headers['set-cookie']).split(';')[0];
};

describe('database outage', () => {
  it('answers 503 with a clear message while PostgreSQL is down, writes nothing, and recovers by itself within 5 s', async () => {
    const cookie = await signIn(handle.app, 'engineer');
    const before = (await request(handle.app).get('/api/projects').set('Cookie', cookie)).body.items.length;

    cluster.stop();
    const health = await request(handle.app).get('/api/health');
    expect(health.status).toBe(503);
    expect(health.body.error.message).toMatch(/database is unavailable/i);
    const write = await request(handle.app).post('/api/projects').set('Cookie', cookie).send({ name: 'Written during the outage' });
    expect(write.status).toBe(503);
    expect(JSON.stringify(write.body)).not.toMatch(/ECONN|sequelize|postgres/i);
    const read = await request(handle.app).get('/api/projects').set('Cookie', cookie);
    expect(read.status).toBe(503);

    cluster.start();
    const t0 = Date.now();
    let status = 0;
    while (Date.now() - t0 < 5_000) {
      status = (await request(handle.app).get('/api/health')).status;
      if (status === 200) break;
      await new Promise((r) => setTimeout(r, 100));
    }
    expect(status).toBe(200);
    expect(Date.now() - t0).toBeLessThan(5_000);
    const after = await request(handle.app).get('/api/projects').set('Cookie', cookie);
    expect(after.status).toBe(200);
    expect(after.body.items.length).toBe(before);
    expect((await request(handle.app).post('/api/projects').set('Cookie', cookie).send({ name: 'HS-2 after the outage' })).status).toBe(201);
  }, 60_000);
});

describe('restarts', () => {
  it('keeps sessions across an app restart (they live in PostgreSQL)', async () => {
    const cookie = await signIn(handle.app, 'checker');
    await handle.close();
    // A new process would start with empty in-memory caches.
    forgetAllSessions();
    forgetSessionUsers();
    handle = createApp();
    const me = await request(handle.app).get('/api/auth/me').set('Cookie', cookie);
    expect(me.status).toBe(200);
    expect(me.body.user.role).toBe('checker');
  });

  it('finishes a request still arriving when told to stop, then exits cleanly', async () => {
    const server = await startServerProcess({ DATABASE_URL: cluster.url });
    const { child } = server;
    const port = Number(new URL(server.url).port);
    const body = JSON.stringify({ email: 'viewer@harrow.example', password: DEMO_PASSWORD });
    const answer = new Promise<number>((resolve, reject) => {
      const req = http.request({ host: '127.0.0.1', port, path: '/api/auth/login', method: 'POST', headers: { 'content-type': 'application/json', 'content-length': Buffer.byteLength(body) } }, (res) => {
        res.resume();
        res.on('end', () => resolve(res.statusCode ?? 0));
      });
      req.on('error', reject);
      // Half the body now, SIGTERM, the rest a moment later: the request is in flight throughout.
      req.write(body.slice(0, 10));
      setTimeout(() => child.kill('SIGTERM'), 100);
      setTimeout(() => req.end(body.slice(10)), 400);
    });
    const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
    expect(await answer).toBe(200);
    expect(await exited, server.output()).toBe(0);
  }, 60_000);
});

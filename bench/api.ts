import autocannon from 'autocannon';
import type { BenchServer } from './server';

export interface LoadResult {
  p50Ms: number;
  p99Ms: number;
  requestsPerSecond: number;
  errors: number;
}

/** The Harrow Sound submersible viewport against the whole catalogue (default limit). */
export const EVALUATE_BODY = JSON.stringify({
  loadCase: {
    pressure: { depth: 1200, latitude: 57, water: 'sea' },
    temperature: { min: 2, max: 25 },
    sustainedHours: 1000,
    cycles: 2000,
    component: { type: 'conical-frustum', minorDiameter: 0.15, thickness: 0.1, includedAngle: 90 },
  },
});

export async function load(server: BenchServer, path: string, options: { method?: 'GET' | 'POST'; body?: string; seconds?: number; connections?: number } = {}): Promise<LoadResult> {
  const result = await autocannon({
    url: `${server.baseUrl}${path}`,
    method: options.method ?? 'GET',
    body: options.body,
    // As a browser does: answers may come gzipped.
    headers: { cookie: server.cookie, 'accept-encoding': 'gzip, deflate, br', ...(options.body ? { 'content-type': 'application/json' } : {}) },
    connections: options.connections ?? 20,
    duration: options.seconds ?? 15,
  });
  return {
    p50Ms: result.latency.p50,
    p99Ms: result.latency.p99,
    requestsPerSecond: Math.round(result.requests.average),
    errors: result.errors + result.timeouts + result.non2xx,
  };
}

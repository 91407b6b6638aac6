import autocannon from 'autocannon';
import type { BenchServer } from './server';
import { FIRST_PAGE_RESULTS } from '../shared/schemas/evaluate';

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

/**
 * Every request a different thickness, so no answer comes from the cache: the cost of really
 * evaluating the whole catalogue per request, the figure an engineer feels (budgeted against health).
 */
export async function loadUncachedEvaluate(server: BenchServer, seconds: number, limit: number = FIRST_PAGE_RESULTS): Promise<LoadResult> {
  // By default what the Evaluate page asks for first (FIRST_PAGE_RESULTS); `limit` for others.
  const base = { ...JSON.parse(EVALUATE_BODY), limit };
  let n = 0;
  const result = await autocannon({
    url: `${server.baseUrl}/api/evaluate`,
    connections: 20,
    duration: seconds,
    headers: { cookie: server.cookie, 'accept-encoding': 'gzip, deflate, br', 'content-type': 'application/json' },
    requests: [
      {
        method: 'POST',
        setupRequest: (req) => {
          n++;
          const thickness = 0.05 + n * 1e-7;
          return { ...req, body: JSON.stringify({ ...base, loadCase: { ...base.loadCase, component: { ...base.loadCase.component, thickness } } }) };
        },
      },
    ],
  });
  return {
    p50Ms: result.latency.p50,
    p99Ms: result.latency.p99,
    requestsPerSecond: Math.round(result.requests.average),
    errors: result.errors + result.timeouts + result.non2xx,
  };
}

/** Size of one evaluation answer with 100 results: the lean form (the default) and the full form, as JSON. */
export async function evaluatePayloadBytes(server: BenchServer): Promise<{ results: number; leanBytes: number; fullBytes: number }> {
  const base = JSON.parse(EVALUATE_BODY);
  const post = async (form: 'lean' | 'full') => {
    const res = await fetch(`${server.baseUrl}/api/evaluate`, {
      method: 'POST',
      headers: { cookie: server.cookie, 'content-type': 'application/json' },
      body: JSON.stringify({ ...base, limit: 100, form }),
    });
    if (!res.ok) throw new Error(`evaluate (${form}) answered ${res.status}`);
    const text = await res.text();
    return { bytes: Buffer.byteLength(text), results: (JSON.parse(text) as { results: unknown[] }).results.length };
  };
  const lean = await post('lean');
  const full = await post('full');
  return { results: lean.results, leanBytes: lean.bytes, fullBytes: full.bytes };
}

/**
 * npm run bench: engine throughput, API latency beside the database floor, client weight.
 * Prints a table, writes bench/results.json, and exits non-zero when a budget is missed.
 */
import os from 'node:os';
import { writeFile, mkdir } from 'node:fs/promises';
import { execFileSync } from 'node:child_process';
import type { EngineBench } from './engine';
import { prepareBenchDatabase } from './prepare';
import { closeDatabase } from '../server/db/sequelize';
import { startBenchServer, rssOf } from './server';
import { load, loadUncachedEvaluate, evaluatePayloadBytes, EVALUATE_BODY } from './api';
import { DEFAULT_LIMIT } from '../shared/schemas/evaluate';
import { initialJsGzipBytes, evaluateReadyMs } from './client';

const BUDGETS = {
  engineModeEvaluationsPerSecond: 2_000_000,
  evaluateP50OverHealthP50: 3,
  evaluateP99Ms: 25,
  /** A new load case each request (nothing cached): its median against health's, and its throughput. */
  uncachedP50OverHealthP50: 3,
  uncachedThroughputOverHealth: 0.4,
  /** The lean answer for 100 results, as JSON. */
  evaluatePayloadBytes: 60 * 1024,
  initialJsGzipBytes: 130 * 1024,
  evaluateReadyMs: 400,
  /** One 64 × 64 mode map (the Evaluate page draws it in the browser). */
  modeMapMs: 100,
};

async function main() {
  const databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) throw new Error('DATABASE_URL (the bench database) is required: run npm run bench');
  const seconds = Number(process.env.BENCH_SECONDS ?? 15);

  console.log('[bench] preparing the bench database');
  const catalogueSize = await prepareBenchDatabase();
  await closeDatabase();

  console.log('[bench] engine (one core, in a fresh process)');
  const engine = JSON.parse(
    execFileSync(process.execPath, ['--import', 'tsx', 'bench/engine-cli.ts', process.env.BENCH_ENGINE_SECONDS ?? '6'], { encoding: 'utf8' }),
  ) as EngineBench;

  console.log(`[bench] starting the server; autocannon, 20 connections, ${seconds} s per endpoint`);
  const server = await startBenchServer(databaseUrl);
  let api;
  let client;
  try {
    const rssBefore = await rssOf(server.pid);
    const health = await load(server, '/api/health', { seconds });
    const evaluate = await load(server, '/api/evaluate', { method: 'POST', body: EVALUATE_BODY, seconds });
    const propertySets = await load(server, '/api/property-sets', { seconds });
    // Budgeted: what the Evaluate page asks for first. Reported beside it: the API's default (100 results).
    const evaluateUncached = await loadUncachedEvaluate(server, seconds);
    const evaluateUncachedDefault = await loadUncachedEvaluate(server, seconds, DEFAULT_LIMIT);
    const rssAfter = await rssOf(server.pid);
    const payload = await evaluatePayloadBytes(server);
    api = {
      catalogueSize,
      evaluate,
      health,
      propertySets: { p50Ms: propertySets.p50Ms, p99Ms: propertySets.p99Ms, errors: propertySets.errors, requestsPerSecond: propertySets.requestsPerSecond },
      evaluateUncached,
      evaluateUncachedDefault,
      payload,
      /** Every process of the server: the cluster primary and its workers. */
      rssBytes: { before: rssBefore, after: rssAfter },
    };
    console.log('[bench] client (chromium)');
    const js = await initialJsGzipBytes();
    const ready = await evaluateReadyMs(server.baseUrl);
    client = { initialJsGzipBytes: js.bytes, initialJsFiles: js.files, evaluateReadyMs: ready.medianMs, evaluateReadyRunsMs: ready.runs };
  } finally {
    await server.stop();
  }

  const results = {
    machine: { cpus: os.cpus().length, cpuModel: os.cpus()[0]?.model ?? 'unknown', memoryBytes: os.totalmem(), node: process.version, platform: `${os.platform()} ${os.release()}`, at: new Date().toISOString() },
    engine,
    api,
    client,
    budgets: BUDGETS,
  };
  await mkdir('bench', { recursive: true });
  await writeFile('bench/results.json', JSON.stringify(results, null, 2) + '\n');

  const checks: [string, string, boolean][] = [
    ['engine mode evaluations / s', `${engine.modeEvaluationsPerSecond.toLocaleString('en-GB')} (≥ ${BUDGETS.engineModeEvaluationsPerSecond.toLocaleString('en-GB')})`, engine.modeEvaluationsPerSecond >= BUDGETS.engineModeEvaluationsPerSecond],
    ['mode map 64 × 64 (cone / sphere)', `${engine.modeMapMs.cone} / ${engine.modeMapMs.sphere} ms (≤ ${BUDGETS.modeMapMs})`, Math.max(engine.modeMapMs.cone, engine.modeMapMs.sphere) <= BUDGETS.modeMapMs],
    ['evaluate p50 vs health p50', `${api.evaluate.p50Ms} ms vs ${api.health.p50Ms} ms (≤ ×${BUDGETS.evaluateP50OverHealthP50})`, api.evaluate.p50Ms <= BUDGETS.evaluateP50OverHealthP50 * Math.max(api.health.p50Ms, 1)],
    ['evaluate p99', `${api.evaluate.p99Ms} ms (≤ ${BUDGETS.evaluateP99Ms})`, api.evaluate.p99Ms <= BUDGETS.evaluateP99Ms],
    ['evaluate errors', `${api.evaluate.errors} (= 0)`, api.evaluate.errors === 0],
    [
      'uncached evaluate, first page, p50',
      `${api.evaluateUncached.p50Ms} ms vs ${api.health.p50Ms} ms (≤ ×${BUDGETS.uncachedP50OverHealthP50})`,
      api.evaluateUncached.p50Ms <= BUDGETS.uncachedP50OverHealthP50 * Math.max(api.health.p50Ms, 1),
    ],
    [
      'uncached evaluate, first page, req/s',
      `${api.evaluateUncached.requestsPerSecond} req/s, ${Math.round((100 * api.evaluateUncached.requestsPerSecond) / api.health.requestsPerSecond)} % of health (≥ ${BUDGETS.uncachedThroughputOverHealth * 100} %)`,
      api.evaluateUncached.requestsPerSecond >= BUDGETS.uncachedThroughputOverHealth * api.health.requestsPerSecond,
    ],
    ['uncached evaluate errors', `${api.evaluateUncached.errors} (= 0)`, api.evaluateUncached.errors === 0],
    [
      'evaluate answer, 100 results',
      `${(api.payload.leanBytes / 1024).toFixed(1)} KB lean, ${(api.payload.fullBytes / 1024).toFixed(1)} KB full (≤ ${BUDGETS.evaluatePayloadBytes / 1024} KB)`,
      api.payload.results === 100 && api.payload.leanBytes <= BUDGETS.evaluatePayloadBytes,
    ],
    ['health / property-sets errors', `${api.health.errors} / ${api.propertySets.errors} (= 0)`, api.health.errors === 0 && api.propertySets.errors === 0],
    ['initial JS (gzip)', `${(client.initialJsGzipBytes / 1024).toFixed(1)} KB (≤ ${BUDGETS.initialJsGzipBytes / 1024} KB)`, client.initialJsGzipBytes <= BUDGETS.initialJsGzipBytes],
    ['Evaluate ready', `${client.evaluateReadyMs} ms (≤ ${BUDGETS.evaluateReadyMs})`, client.evaluateReadyMs <= BUDGETS.evaluateReadyMs],
  ];
  console.log('\nendpoint          p50 ms  p99 ms  req/s  errors');
  for (const [name, r] of [['health', api.health], ['evaluate', api.evaluate], ['property-sets', api.propertySets], ['uncached, page', api.evaluateUncached], ['uncached, 100', api.evaluateUncachedDefault]] as const) {
    console.log(`${name.padEnd(17)} ${String(r.p50Ms).padStart(6)}  ${String(r.p99Ms).padStart(6)}  ${String(r.requestsPerSecond).padStart(5)}  ${String(r.errors).padStart(6)}`);
  }
  console.log(`\nengine per component: ${Object.entries(engine.perComponent).map(([k, v]) => `${k} ${v.toLocaleString('en-GB')}`).join(', ')}`);
  console.log(`engine with every candidate's full result (ranked by required thickness): ${engine.fullResultsModeEvaluationsPerSecond.toLocaleString('en-GB')} / s`);
  console.log(`server RSS (primary and workers): ${(api.rssBytes.before / 2 ** 20).toFixed(0)} MB before, ${(api.rssBytes.after / 2 ** 20).toFixed(0)} MB after the load\n`);
  let failed = 0;
  for (const [name, value, ok] of checks) {
    console.log(`${ok ? 'ok  ' : 'MISS'} ${name.padEnd(32)} ${value}`);
    if (!ok) failed++;
  }
  console.log(`\nwritten bench/results.json${failed ? `; ${failed} budget(s) missed` : '; all budgets met'}`);
  process.exitCode = failed ? 1 : 0;
}

main().catch((err) => {
  console.error('[bench] failed:', err);
  process.exitCode = 2;
});

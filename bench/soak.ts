/**
 * npm run soak: 60 s of mixed load at 50 connections on loopback — catalogue reads, evaluations
 * (varying thickness, so many are computed, not cached) and shortlist note edits — against the
 * real server on the bench database. Passes with 0 errors and bounded memory; prints RSS before
 * and after and writes bench/soak.json.
 */
import autocannon from 'autocannon';
import { writeFile } from 'node:fs/promises';
import { prepareBenchDatabase, BENCH_USER } from './prepare';
import { closeDatabase } from '../server/db/sequelize';
import { initModels, User } from '../server/db/models';
import { createLoadCase, createProject } from '../server/modules/projects/service';
import { addItem, createShortlist } from '../server/modules/projects/shortlists';
import { PropertySet } from '../server/db/models';
import { startBenchServer, rssOf } from './server';
import { EVALUATE_BODY } from './api';

const SECONDS = Number(process.env.SOAK_SECONDS ?? 60);
const CONNECTIONS = 50;
/** Memory may grow with caches, but not without bound: budget for the growth over the run. */
const RSS_GROWTH_BUDGET = 256 * 2 ** 20;

async function main() {
  const databaseUrl = process.env.DATABASE_URL!;
  await prepareBenchDatabase();
  initModels();
  const user = (await User.findOne({ where: { email: BENCH_USER.email } }))!;
  const actor = { id: user.id, role: user.role };
  const project = await createProject(actor, { name: 'Soak: HS-2 viewports', description: '' });
  const lc = await createLoadCase(actor, project.id, { name: 'Forward viewport', loadCase: JSON.parse(EVALUATE_BODY).loadCase, notes: '' });
  const sl = await createShortlist(actor, project.id, { loadCaseId: lc.id, name: 'Soak shortlist' });
  const set = (await PropertySet.findOne({ where: { status: 'published' } }))!;
  const withItem = await addItem(actor, sl.id, { propertySetId: set.id, note: 'soak' });
  const itemId = withItem.items[0].id;
  await closeDatabase();

  const server = await startBenchServer(databaseUrl);
  const rssBefore = await rssOf(server.pid);
  const base = JSON.parse(EVALUATE_BODY);
  let n = 0;
  const result = await autocannon({
    url: server.baseUrl,
    connections: CONNECTIONS,
    duration: SECONDS,
    headers: { cookie: server.cookie, 'accept-encoding': 'gzip' },
    requests: [
      {
        setupRequest: (req) => {
          n++;
          const kind = n % 4;
          if (kind === 0) return { ...req, method: 'GET', path: `/api/property-sets?family=${['acrylic', 'glass', 'steel', 'titanium-alloy'][n % 8 >> 1]}` };
          if (kind === 1 || kind === 2) {
            // 40 thicknesses from 50 to 128 mm: the first pass computes, later passes hit the cache.
            const thickness = 0.05 + (n % 40) * 0.002;
            const body = JSON.stringify({ ...base, loadCase: { ...base.loadCase, component: { ...base.loadCase.component, thickness } } });
            return { ...req, method: 'POST', path: '/api/evaluate', body, headers: { ...req.headers, 'content-type': 'application/json' } };
          }
          return {
            ...req,
            method: 'PATCH',
            path: `/api/shortlists/${sl.id}/items/${itemId}`,
            body: JSON.stringify({ note: `Checked under load, pass ${n}` }),
            headers: { ...req.headers, 'content-type': 'application/json' },
          };
        },
      },
    ],
  });
  const rssAfter = await rssOf(server.pid);
  await server.stop();
  const errors = result.errors + result.timeouts + result.non2xx;
  const out = {
    seconds: SECONDS,
    connections: CONNECTIONS,
    requests: result.requests.total,
    requestsPerSecond: Math.round(result.requests.average),
    p50Ms: result.latency.p50,
    p99Ms: result.latency.p99,
    errors,
    rssBytes: { before: rssBefore, after: rssAfter },
  };
  await writeFile('bench/soak.json', JSON.stringify(out, null, 2) + '\n');
  console.log(
    `[soak] ${out.requests} requests in ${SECONDS} s at ${CONNECTIONS} connections: ${out.requestsPerSecond} req/s, p50 ${out.p50Ms} ms, p99 ${out.p99Ms} ms, ${errors} errors; ` +
      `RSS ${(rssBefore / 2 ** 20).toFixed(0)} MB before, ${(rssAfter / 2 ** 20).toFixed(0)} MB after`,
  );
  const ok = errors === 0 && rssAfter - rssBefore < RSS_GROWTH_BUDGET;
  console.log(ok ? '[soak] passed' : '[soak] FAILED');
  process.exitCode = ok ? 0 : 1;
}

main().catch((err) => {
  console.error('[soak] failed:', err);
  process.exitCode = 2;
});

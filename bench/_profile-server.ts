import { spawn } from 'node:child_process';
import autocannon from 'autocannon';
import { BENCH_USER } from './prepare';
const path = process.argv[2] ?? '/api/health';
const child = spawn(process.execPath, ['--cpu-prof', '--cpu-prof-dir=/tmp/sprof', '--import', 'tsx', 'server/index.ts'], {
  env: { ...process.env, NODE_ENV: 'production', PORT: '0', SESSION_SECRET: 'x'.repeat(40), COOKIE_SECURE: 'false', LOGIN_RATE_LIMIT: '1000' },
  stdio: ['ignore', 'pipe', 'inherit'],
});
const port = await new Promise<number>((r) => child.stdout!.on('data', (d: Buffer) => { const m = String(d).match(/localhost:(\d+)/); if (m) r(Number(m[1])); }));
const res = await fetch(`http://127.0.0.1:${port}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: BENCH_USER.email, password: BENCH_USER.password }) });
const cookie = (res.headers.get('set-cookie') ?? '').split(';')[0];
const body = path === '/api/evaluate' ? (await import('./api')).EVALUATE_BODY : undefined;
const r = await autocannon({ url: `http://127.0.0.1:${port}${path}`, connections: 20, duration: 5, method: body ? 'POST' : 'GET', body, headers: { cookie, ...(body ? { 'content-type': 'application/json' } : {}) } });
console.log(path, 'p50', r.latency.p50, 'p99', r.latency.p99, 'rps', r.requests.average, 'non2xx', r.non2xx);
child.kill('SIGINT');
await new Promise((r) => child.on('exit', r));

import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { BENCH_USER } from './prepare';

function serverNodeFlags(): string {
  const pkg = JSON.parse(readFileSync('package.json', 'utf8')) as { config?: { serverNodeFlags?: string } };
  return pkg.config?.serverNodeFlags ?? '';
}

export interface BenchServer {
  baseUrl: string;
  cookie: string;
  pid: number;
  stop(): Promise<void>;
}

/** Starts the real server (production mode) on a free loopback port and signs in the bench engineer. */
export async function startBenchServer(databaseUrl: string): Promise<BenchServer> {
  // Started as npm start starts it: the same Node flags (package.json config.serverNodeFlags).
  // BENCH_NODE_FLAGS adds flags for a look inside, e.g. '--cpu-prof --cpu-prof-dir=/tmp/prof' (workers inherit them).
  const flags = [...serverNodeFlags().split(' '), ...(process.env.BENCH_NODE_FLAGS ?? '').split(' ')].filter(Boolean);
  const child: ChildProcess = spawn(process.execPath, [...flags, '--import', 'tsx', 'server/index.ts'], {
    env: {
      ...process.env,
      NODE_ENV: 'production',
      PORT: '0',
      HOST: '127.0.0.1',
      APP_URL: 'http://127.0.0.1',
      DATABASE_URL: databaseUrl,
      SESSION_SECRET: randomBytes(32).toString('hex'),
      COOKIE_SECURE: 'false',
      LOGIN_RATE_LIMIT: '1000',
      // The load generator is one account on many connections: the per-account evaluation limit would stop it.
      EVALUATE_RATE_LIMIT: '100000000',
    },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  const port = await new Promise<number>((resolve, reject) => {
    let out = '';
    const timer = setTimeout(() => reject(new Error(`server did not start: ${out}`)), 30_000);
    child.stdout!.on('data', (chunk: Buffer) => {
      out += chunk.toString();
      const m = out.match(/serving on http:\/\/localhost:(\d+)/);
      if (m) {
        clearTimeout(timer);
        resolve(Number(m[1]));
      }
    });
    child.on('exit', (code) => reject(new Error(`server exited with ${code}: ${out}`)));
  });
  const baseUrl = `http://127.0.0.1:${port}`;
  const res = await fetch(`${baseUrl}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: BENCH_USER.email, password: BENCH_USER.password }),
  });
  if (!res.ok) throw new Error(`bench sign-in failed: ${res.status} ${await res.text()}`);
  const cookie = (res.headers.get('set-cookie') ?? '').split(';')[0];
  return {
    baseUrl,
    cookie,
    pid: child.pid!,
    stop: () =>
      new Promise<void>((resolve) => {
        child.once('exit', () => resolve());
        child.kill('SIGTERM');
      }),
  };
}

/** Resident memory of a process in bytes (Linux /proc). */
async function rssOfOne(pid: number): Promise<number> {
  const { readFile } = await import('node:fs/promises');
  const status = await readFile(`/proc/${pid}/status`, 'utf8').catch(() => '');
  const kb = Number(status.match(/VmRSS:\s+(\d+)\s+kB/)?.[1] ?? 0);
  return kb * 1024;
}

/** The process's children (Linux /proc, every thread's list). */
async function childrenOf(pid: number): Promise<number[]> {
  const { readdir, readFile } = await import('node:fs/promises');
  const tasks = await readdir(`/proc/${pid}/task`).catch(() => [] as string[]);
  const lists = await Promise.all(tasks.map((t) => readFile(`/proc/${pid}/task/${t}/children`, 'utf8').catch(() => '')));
  return [...new Set(lists.join(' ').split(/\s+/).filter(Boolean).map(Number))];
}

/** Resident memory of a process and all its descendants (the cluster primary and its workers), in bytes. */
export async function rssOf(pid: number): Promise<number> {
  const children = await childrenOf(pid);
  const own = await rssOfOne(pid);
  const below = await Promise.all(children.map((c) => rssOf(c)));
  return own + below.reduce((a, b) => a + b, 0);
}

import { spawn, type ChildProcess } from 'node:child_process';
import request from 'supertest';

/**
 * An app server in a process of its own (server/index.ts, as npm start runs it). One worker
 * unless `env.WEB_CONCURRENCY` says otherwise, so each process is one app with its own caches.
 */
export interface ServerProcess {
  child: ChildProcess;
  url: string;
  /** Everything the process printed, for failure messages. */
  output(): string;
  stop(): Promise<void>;
}

export async function startServerProcess(env: Record<string, string> = {}): Promise<ServerProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: { ...process.env, NODE_ENV: 'test', PORT: '0', HOST: '127.0.0.1', WEB_CONCURRENCY: '1', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  child.stderr!.on('data', (d: Buffer) => (out += d.toString()));
  const port = await new Promise<number>((resolve, reject) => {
    child.stdout!.on('data', (d: Buffer) => {
      out += d.toString();
      const m = out.match(/serving on http:\/\/localhost:(\d+)/);
      if (m) resolve(Number(m[1]));
    });
    child.on('exit', (code) => reject(new Error(`server exited early (${code}): ${out}`)));
  });
  const url = `http://127.0.0.1:${port}`;
  // Listening on the change feed is part of being ready: wait until every worker says so.
  const deadline = Date.now() + 20_000;
  const workers = Number(env.WEB_CONCURRENCY ?? 1);
  while ((out.match(/process \d+ listening for changes/g) ?? []).length < workers) {
    if (Date.now() > deadline) throw new Error(`server never listened for changes: ${out}`);
    await new Promise((r) => setTimeout(r, 50));
  }
  return {
    child,
    url,
    output: () => out,
    stop: async () => {
      if (child.exitCode !== null) return;
      const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
      child.kill('SIGTERM');
      await exited;
    },
  };
}

/** Signs in on one server and returns the session cookie (good on every server of the database). */
export async function sessionCookie(url: string, email: string, password: string): Promise<string> {
  const res = await request(url).post('/api/auth/login').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  const cookie = (res.headers['set-cookie'] as unknown as string[] | undefined)?.find((c) => c.startsWith('isobath.sid='));
  if (!cookie) throw new Error('no session cookie');
  return cookie.split(';')[0];
}

/** Polls `probe` until it returns true or `ms` pass; returns how long it took (Infinity if never). */
export async function within(ms: number, probe: () => Promise<boolean>): Promise<number> {
  const started = Date.now();
  for (;;) {
    if (await probe()) return Date.now() - started;
    if (Date.now() - started > ms) return Number.POSITIVE_INFINITY;
    await new Promise((r) => setTimeout(r, 20));
  }
}

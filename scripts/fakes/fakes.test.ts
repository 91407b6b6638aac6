// The fakes started together in-process, and index.ts run as a script the way the lead's
// start script will run it.
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtemp, readdir, rm } from 'node:fs/promises';
import { connect, createServer, type Server } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { GetObjectCommand, HeadBucketCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import nodemailer from 'nodemailer';
import { afterEach, describe, expect, it } from 'vitest';
import { startFakes, type Fakes } from './index';
import { startSmtpFake } from './smtp';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const BUCKET = 'isobath-fakes-test';
const cleanups: Array<() => Promise<unknown>> = [];

afterEach(async () => {
  while (cleanups.length) await cleanups.pop()!();
});

async function tempDir(): Promise<string> {
  const dir = await mkdtemp(path.join(tmpdir(), 'isobath-fakes-'));
  cleanups.push(() => rm(dir, { recursive: true, force: true }));
  return dir;
}

function s3For(endpoint: string): S3Client {
  const client = new S3Client({
    endpoint,
    region: 'us-east-1',
    forcePathStyle: true,
    credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
    requestChecksumCalculation: 'WHEN_REQUIRED',
    maxAttempts: 1,
  });
  cleanups.push(async () => client.destroy());
  return client;
}

/** Resolves with the SMTP greeting line, or rejects when nothing listens. */
function smtpGreeting(port: number): Promise<string> {
  return new Promise((resolve, reject) => {
    const socket = connect(port, '127.0.0.1');
    socket.once('data', (data) => {
      socket.destroy();
      resolve(data.toString());
    });
    socket.once('error', reject);
  });
}

function refused(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = connect(port, '127.0.0.1');
    socket.once('connect', () => {
      socket.destroy();
      resolve(false);
    });
    socket.once('error', (err: NodeJS.ErrnoException) => resolve(err.code === 'ECONNREFUSED'));
  });
}

async function sendTo(fakes: Fakes, subject: string): Promise<void> {
  const transport = nodemailer.createTransport({ host: fakes.smtp.host, port: fakes.smtp.port, secure: false });
  try {
    await transport.sendMail({ from: 'Isobath <no-reply@isobath.example>', to: 'crew@harrow-sound.example', subject, text: 'body' });
  } finally {
    transport.close();
  }
}

describe('startFakes', () => {
  it('starts both fakes on free loopback ports, with the bucket created, and stops them', async () => {
    const dataDir = await tempDir();
    const fakes = await startFakes({ dataDir, bucket: BUCKET });
    cleanups.push(() => fakes.stop());

    expect(fakes.s3.port).toBeGreaterThan(0);
    expect(fakes.smtp.port).toBeGreaterThan(0);
    expect(fakes.s3.port).not.toBe(fakes.smtp.port);
    expect(fakes.s3.endpoint).toBe(`http://127.0.0.1:${fakes.s3.port}`);
    expect(fakes.smtp.host).toBe('127.0.0.1');
    expect(fakes.mailDir).toBe(path.join(dataDir, 'mail'));

    await expect(s3For(fakes.s3.endpoint).send(new HeadBucketCommand({ Bucket: BUCKET }))).resolves.toBeDefined();
    // RFC 5321 §4.2: a server ready for mail greets with reply code 220.
    expect(await smtpGreeting(fakes.smtp.port)).toMatch(/^220 /);

    await sendTo(fakes, 'Submersible 1,200 m: hull record');
    const caught = await readdir(fakes.mailDir);
    expect(caught.filter((n) => n.endsWith('.json'))).toHaveLength(1);
    expect(caught.filter((n) => n.startsWith('.'))).toEqual([]);

    await fakes.stop();
    expect(await refused(fakes.s3.port)).toBe(true);
    expect(await refused(fakes.smtp.port)).toBe(true);
    await expect(fakes.stop()).resolves.toBeUndefined(); // stopping twice is harmless
  });

  it('keeps stored objects across a restart on the same data directory', async () => {
    const dataDir = await tempDir();
    const first = await startFakes({ dataDir, bucket: BUCKET });
    await s3For(first.s3.endpoint).send(
      new PutObjectCommand({ Bucket: BUCKET, Key: 'kept.txt', Body: Buffer.from('still here'), ContentType: 'text/plain' }),
    );
    await first.stop();

    const second = await startFakes({ dataDir, bucket: BUCKET });
    cleanups.push(() => second.stop());
    const out = await s3For(second.s3.endpoint).send(new GetObjectCommand({ Bucket: BUCKET, Key: 'kept.txt' }));
    expect(await out.Body!.transformToString()).toBe('still here');
  });

  it('fails to start, leaving nothing running, when the SMTP port is taken', async () => {
    const dataDir = await tempDir();
    const blocker: Server = createServer();
    await new Promise<void>((resolve) => blocker.listen(0, '127.0.0.1', resolve));
    cleanups.push(() => new Promise((resolve) => blocker.close(resolve)));
    const taken = (blocker.address() as { port: number }).port;
    const s3Port = await new Promise<number>((resolve) => {
      const probe = createServer().listen(0, '127.0.0.1', () => {
        const { port } = probe.address() as { port: number };
        probe.close(() => resolve(port));
      });
    });

    await expect(startFakes({ dataDir, bucket: BUCKET, s3Port, smtpPort: taken })).rejects.toMatchObject({ code: 'EADDRINUSE' });
    expect(await refused(s3Port)).toBe(true);
  });
});

describe('the mail catcher', () => {
  it('refuses a message over its size limit and saves nothing', async () => {
    const mailDir = path.join(await tempDir(), 'mail');
    const catcher = await startSmtpFake({ port: 0, mailDir, maxBytes: 2_000 });
    cleanups.push(() => catcher.stop());
    const transport = nodemailer.createTransport({ host: catcher.host, port: catcher.port, secure: false });
    cleanups.push(async () => transport.close());
    const message = { from: 'no-reply@isobath.example', to: 'crew@harrow-sound.example', subject: 'Large' };
    await expect(transport.sendMail({ ...message, text: 'x'.repeat(10_000) })).rejects.toThrow();
    expect(await readdir(mailDir)).toEqual([]);
    await transport.sendMail({ ...message, subject: 'Small', text: 'fits' });
    expect((await readdir(mailDir)).filter((n) => n.endsWith('.json'))).toHaveLength(1);
  });
});

describe('tsx scripts/fakes/index.ts', () => {
  function run(env: Record<string, string>): { child: ChildProcess; ready: Promise<string>; exit: Promise<number | null>; output: () => string } {
    const child = spawn(path.join(ROOT, 'node_modules/.bin/tsx'), ['scripts/fakes/index.ts'], {
      cwd: ROOT,
      env: { ...process.env, NODE_ENV: 'test', SESSION_SECRET: 'fakes-script-test-secret-fakes-script', S3_BUCKET: BUCKET, ...env },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let output = '';
    const ready = new Promise<string>((resolve, reject) => {
      child.stdout!.on('data', (data: Buffer) => {
        output += data.toString();
        const line = output.split('\n').find((l) => l.startsWith('[isobath] fakes ready:'));
        if (line) resolve(line);
      });
      child.stderr!.on('data', (data: Buffer) => (output += data.toString()));
      child.once('exit', () => reject(new Error(`exited before ready:\n${output}`)));
    });
    ready.catch(() => {});
    const exit = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
    cleanups.push(async () => {
      if (child.exitCode === null && child.signalCode === null) {
        child.kill('SIGKILL');
        await exit;
      }
    });
    return { child, ready, exit, output: () => output };
  }

  it('prints one ready line with the variables to use, serves both, and exits 0 on SIGTERM', async () => {
    const dataDir = await tempDir();
    const { child, ready, exit } = run({ ISOBATH_S3_PORT: '0', ISOBATH_SMTP_PORT: '0', ISOBATH_FAKES_DATA_DIR: dataDir });
    const line = await ready;
    const vars = Object.fromEntries([...line.matchAll(/(\w+)=(\S+)/g)].map((m) => [m[1], m[2]]));
    expect(Object.keys(vars).sort()).toEqual(['MAIL_CATCHER_DIR', 'S3_BUCKET', 'S3_ENDPOINT', 'SMTP_HOST', 'SMTP_PORT']);
    expect(vars.S3_BUCKET).toBe(BUCKET);
    expect(vars.MAIL_CATCHER_DIR).toBe(path.join(dataDir, 'mail'));
    expect(vars.S3_ENDPOINT).toMatch(/^http:\/\/127\.0\.0\.1:\d+$/);
    expect(vars.SMTP_HOST).toBe('127.0.0.1');

    await expect(s3For(vars.S3_ENDPOINT).send(new HeadBucketCommand({ Bucket: BUCKET }))).resolves.toBeDefined();
    expect(await smtpGreeting(Number(vars.SMTP_PORT))).toMatch(/^220 /);
    expect((await readdir(path.join(dataDir, 's3'))).includes(BUCKET)).toBe(true);

    child.kill('SIGTERM');
    expect(await exit).toBe(0);
    expect(await refused(Number(vars.SMTP_PORT))).toBe(true);
    expect(await refused(Number(new URL(vars.S3_ENDPOINT).port))).toBe(true);
  }, 30_000);

  it('exits 1 with a message when a port variable is not a port', async () => {
    const dataDir = await tempDir();
    const { exit, output } = run({ ISOBATH_S3_PORT: 'eighty', ISOBATH_SMTP_PORT: '0', ISOBATH_FAKES_DATA_DIR: dataDir });
    expect(await exit).toBe(1);
    expect(output()).toContain('ISOBATH_S3_PORT must be a port number');
  }, 30_000);
});

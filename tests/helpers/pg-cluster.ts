import { execFileSync } from 'node:child_process';
import { chmodSync, chownSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import path from 'node:path';

/**
 * A disposable PostgreSQL cluster of its own (Debian's binaries, run as the postgres user, on a
 * free loopback port), for tests that stop and start the database under a running app.
 */
export interface Cluster {
  url: string;
  stop(): void;
  start(): void;
  destroy(): void;
}

const bin = () => {
  const versions = readdirSync('/usr/lib/postgresql').sort((a, b) => Number(a) - Number(b));
  return `/usr/lib/postgresql/${versions[versions.length - 1]}/bin`;
};
const asPostgres = (cmd: string, args: string[]) => execFileSync('runuser', ['-u', 'postgres', '--', cmd, ...args], { stdio: 'pipe' });
const postgresUid = () => Number(execFileSync('id', ['-u', 'postgres']).toString().trim());
const postgresGid = () => Number(execFileSync('id', ['-g', 'postgres']).toString().trim());

async function freePort(): Promise<number> {
  const s = createServer();
  await new Promise<void>((resolve) => s.listen(0, '127.0.0.1', resolve));
  const port = (s.address() as { port: number }).port;
  await new Promise<void>((resolve) => s.close(() => resolve()));
  return port;
}

export async function startCluster(): Promise<Cluster> {
  const root = mkdtempSync('/tmp/isobath-fault-pg-');
  chmodSync(root, 0o755);
  chownSync(root, postgresUid(), postgresGid());
  const data = path.join(root, 'data');
  const port = await freePort();
  const b = bin();
  asPostgres(`${b}/initdb`, ['-D', data, '-U', 'postgres', '--auth-local=trust', '--auth-host=trust', '-E', 'UTF8', '--locale=C.UTF-8']);
  const opts = `-c listen_addresses=127.0.0.1 -p ${port} -k ${root} -c fsync=off`;
  const start = () => asPostgres(`${b}/pg_ctl`, ['-D', data, '-l', path.join(root, 'log'), '-w', '-t', '30', '-o', opts, 'start']);
  const stop = () => asPostgres(`${b}/pg_ctl`, ['-D', data, '-m', 'fast', '-w', 'stop']);
  start();
  asPostgres(`${b}/psql`, ['-h', root, '-p', String(port), '-U', 'postgres', '-qc', 'CREATE DATABASE isobath_fault']);
  return {
    url: `postgres://postgres@127.0.0.1:${port}/isobath_fault`,
    stop,
    start,
    destroy: () => {
      try {
        stop();
      } catch {
        /* already stopped */
      }
      rmSync(root, { recursive: true, force: true });
    },
  };
}

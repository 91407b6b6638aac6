/**
 * Set-up shared by the unit tests of the outside services (mail, storage) against their local
 * fakes; not used by the app. Environment variables are set per test and the process's own are
 * given back after the file; spies are restored after each test.
 */
import { createServer } from 'node:net';
import { afterAll, afterEach, vi } from 'vitest';
import { resetEnvCache } from '../config/env';

/** Vars to set; undefined removes one. */
export type EnvVars = Record<string, string | undefined>;

/**
 * Registers the file's hooks and returns `useEnv`, which sets (or removes) variables, drops the
 * cached environment and closes the service's client (`closeClient`) so both are read again.
 * Call at the top of a test file.
 */
export function serviceTestEnv(closeClient: () => void): (vars: EnvVars) => void {
  const savedEnv = { ...process.env };
  afterEach(() => {
    vi.restoreAllMocks();
  });
  afterAll(() => {
    process.env = savedEnv;
    resetEnvCache();
  });
  return (vars) => {
    for (const [name, value] of Object.entries(vars)) {
      if (value === undefined) delete process.env[name];
      else process.env[name] = value;
    }
    resetEnvCache();
    closeClient();
  };
}

/** A port that nothing listens on: bound, then released. */
export async function closedPort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as { port: number };
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

import { Sequelize } from 'sequelize';
import { env } from '../config/env';

let instance: Sequelize | undefined;

/** One Sequelize instance per process; models are bound to it in models/index.ts. */
export function sequelize(): Sequelize {
  if (!instance) {
    instance = new Sequelize(env().DATABASE_URL, {
      dialect: 'postgres',
      logging: false,
      // A couple of connections stay open so the first request after a quiet spell does not pay for
      // a new connection and its SCRAM handshake.
      pool: { max: env().DATABASE_POOL_MAX, min: Math.min(2, env().DATABASE_POOL_MAX), idle: 60_000, acquire: 5_000 },
      dialectOptions: { connectionTimeoutMillis: 3_000, statement_timeout: 15_000 },
      define: { underscored: true },
    });
  }
  return instance;
}

export async function closeDatabase(): Promise<void> {
  if (instance) {
    await instance.close();
    instance = undefined;
  }
}

/** Connections in use or awaited right now (0 when no query is running), for a clean shutdown. */
export function databaseBusy(): number {
  const pool = (instance?.connectionManager as unknown as { pool?: { using?: number; waiting?: number } } | undefined)?.pool;
  return pool ? (pool.using ?? 0) + (pool.waiting ?? 0) : 0;
}

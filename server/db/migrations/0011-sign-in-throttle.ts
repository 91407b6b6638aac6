import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// Failed sign-ins, counted in PostgreSQL so a lock survives a restart and every process sees it:
// one row per address (email '') and one per address and account name. See
// docs/decisions/025-sign-in-throttle.md.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE sign_in_throttles (
      id SERIAL PRIMARY KEY,
      address TEXT NOT NULL,
      email TEXT NOT NULL DEFAULT '',
      failures INTEGER NOT NULL CHECK (failures > 0),
      locked_until TIMESTAMPTZ,
      last_failure_at TIMESTAMPTZ NOT NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      UNIQUE (address, email)
    );
    CREATE INDEX sign_in_throttles_last_failure_idx ON sign_in_throttles (last_failure_at);
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`DROP TABLE IF EXISTS sign_in_throttles;`);
};

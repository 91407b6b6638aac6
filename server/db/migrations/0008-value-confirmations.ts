import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// Confirming a value of a published property set against its source is a reviewed step: a
// librarian proposes the location (and, optionally, the page of the stored document), a
// different person approves or rejects it. One open proposal per value.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE value_confirmations (
      id SERIAL PRIMARY KEY,
      property_set_id INTEGER NOT NULL REFERENCES property_sets(id),
      value_key TEXT NOT NULL,
      location TEXT NOT NULL,
      source TEXT,
      document_page INTEGER CHECK (document_page IS NULL OR document_page > 0),
      status TEXT NOT NULL DEFAULT 'proposed' CHECK (status IN ('proposed', 'approved', 'rejected')),
      proposed_by_id INTEGER NOT NULL REFERENCES users(id),
      decided_by_id INTEGER REFERENCES users(id),
      decided_at TIMESTAMPTZ,
      comment TEXT,
      lock_version INTEGER NOT NULL DEFAULT 0,
      created_at TIMESTAMPTZ NOT NULL,
      updated_at TIMESTAMPTZ NOT NULL
    );
    CREATE UNIQUE INDEX value_confirmations_one_open ON value_confirmations (property_set_id, value_key) WHERE status = 'proposed';
    CREATE INDEX value_confirmations_status_idx ON value_confirmations (status);
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`DROP TABLE IF EXISTS value_confirmations;`);
};

import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// Catalogue, accounts, sessions and the audit log.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE users (
      id SERIAL PRIMARY KEY,
      email TEXT NOT NULL UNIQUE CHECK (email = lower(email)),
      name TEXT NOT NULL,
      role TEXT NOT NULL CHECK (role IN ('viewer','engineer','checker','librarian','admin')),
      password_hash TEXT,
      active BOOLEAN NOT NULL DEFAULT TRUE,
      last_login_at TIMESTAMPTZ,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    );

    CREATE TABLE materials (
      id SERIAL PRIMARY KEY,
      name TEXT NOT NULL UNIQUE,
      family TEXT NOT NULL,
      transparent BOOLEAN NOT NULL,
      description TEXT,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    );
    CREATE INDEX materials_family_idx ON materials (family);

    CREATE TABLE data_references (
      id SERIAL PRIMARY KEY,
      kind TEXT NOT NULL CHECK (kind IN ('standard','handbook','paper','test-report','supplier-data-sheet')),
      title TEXT NOT NULL,
      authors TEXT,
      year INTEGER,
      identifier TEXT,
      location TEXT,
      note TEXT,
      created_by_id INTEGER REFERENCES users(id),
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    );

    CREATE TABLE property_sets (
      id SERIAL PRIMARY KEY,
      material_id INTEGER NOT NULL REFERENCES materials(id),
      reference_id INTEGER REFERENCES data_references(id),
      condition TEXT NOT NULL,
      status TEXT NOT NULL DEFAULT 'draft' CHECK (status IN ('draft','in-review','published','retired')),
      version INTEGER NOT NULL DEFAULT 1,
      lineage_id INTEGER,
      supersedes_id INTEGER REFERENCES property_sets(id),
      superseded_by_id INTEGER REFERENCES property_sets(id),
      density DOUBLE PRECISION NOT NULL,
      youngs_modulus DOUBLE PRECISION NOT NULL,
      poissons_ratio DOUBLE PRECISION NOT NULL,
      tensile_strength DOUBLE PRECISION NOT NULL,
      tensile_yield DOUBLE PRECISION,
      compressive_strength DOUBLE PRECISION NOT NULL,
      compressive_yield DOUBLE PRECISION,
      shear_strength DOUBLE PRECISION NOT NULL,
      elongation DOUBLE PRECISION,
      luminous_transmittance DOUBLE PRECISION,
      service_temp_min DOUBLE PRECISION NOT NULL,
      service_temp_max DOUBLE PRECISION NOT NULL CHECK (service_temp_max >= service_temp_min),
      value_details JSONB NOT NULL DEFAULT '{}'::jsonb,
      temperature_factors JSONB NOT NULL DEFAULT '[]'::jsonb,
      sustained_load_factors JSONB NOT NULL DEFAULT '[]'::jsonb,
      cyclic_factors JSONB NOT NULL DEFAULT '[]'::jsonb,
      drafted_by_id INTEGER REFERENCES users(id),
      approved_by_id INTEGER REFERENCES users(id),
      published_at TIMESTAMPTZ,
      retired_at TIMESTAMPTZ,
      lock_version INTEGER NOT NULL DEFAULT 0,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      CONSTRAINT published_has_reference CHECK (status NOT IN ('published') OR reference_id IS NOT NULL)
    );
    CREATE INDEX property_sets_status_idx ON property_sets (status);
    CREATE INDEX property_sets_material_idx ON property_sets (material_id);
    CREATE INDEX property_sets_lineage_idx ON property_sets (lineage_id);

    CREATE TABLE audit_log (
      id BIGSERIAL PRIMARY KEY,
      actor_id INTEGER REFERENCES users(id),
      action TEXT NOT NULL,
      entity_type TEXT NOT NULL,
      entity_id TEXT,
      before JSONB,
      after JSONB,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now()
    );
    CREATE INDEX audit_log_entity_idx ON audit_log (entity_type, entity_id);
    CREATE INDEX audit_log_created_idx ON audit_log (created_at DESC);

    -- Session store for connect-pg-simple (it does not create its own table).
    CREATE TABLE session (
      sid VARCHAR NOT NULL PRIMARY KEY,
      sess JSON NOT NULL,
      expire TIMESTAMP(6) NOT NULL
    );
    CREATE INDEX session_expire_idx ON session (expire);
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE IF EXISTS session, audit_log, property_sets, data_references, materials, users CASCADE;
  `);
};

import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// Projects with members, saved load cases, shortlists with sign-off, frozen design records,
// invitations and password resets.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE projects (
      id SERIAL PRIMARY KEY,
      name TEXT NOT NULL,
      description TEXT NOT NULL DEFAULT '',
      owner_id INTEGER NOT NULL REFERENCES users(id),
      lock_version INTEGER NOT NULL DEFAULT 0,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    );

    CREATE TABLE project_members (
      project_id INTEGER NOT NULL REFERENCES projects(id),
      user_id INTEGER NOT NULL REFERENCES users(id),
      added_by_id INTEGER REFERENCES users(id),
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      PRIMARY KEY (project_id, user_id)
    );
    CREATE INDEX project_members_user_idx ON project_members (user_id);

    CREATE TABLE load_cases (
      id SERIAL PRIMARY KEY,
      project_id INTEGER NOT NULL REFERENCES projects(id),
      name TEXT NOT NULL,
      load_case JSONB NOT NULL,
      filters JSONB,
      notes TEXT NOT NULL DEFAULT '',
      created_by_id INTEGER REFERENCES users(id),
      lock_version INTEGER NOT NULL DEFAULT 0,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    );
    CREATE INDEX load_cases_project_idx ON load_cases (project_id);

    CREATE TABLE shortlists (
      id SERIAL PRIMARY KEY,
      project_id INTEGER NOT NULL REFERENCES projects(id),
      load_case_id INTEGER NOT NULL REFERENCES load_cases(id),
      name TEXT NOT NULL,
      status TEXT NOT NULL DEFAULT 'open' CHECK (status IN ('open','submitted','checked','returned')),
      author_id INTEGER NOT NULL REFERENCES users(id),
      checker_id INTEGER REFERENCES users(id),
      submitted_at TIMESTAMPTZ,
      checked_at TIMESTAMPTZ,
      returned_comment TEXT,
      check_comment TEXT,
      lock_version INTEGER NOT NULL DEFAULT 0,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      CONSTRAINT checker_is_not_author CHECK (checker_id IS NULL OR checker_id <> author_id)
    );
    CREATE INDEX shortlists_project_idx ON shortlists (project_id);

    CREATE TABLE shortlist_items (
      id SERIAL PRIMARY KEY,
      shortlist_id INTEGER NOT NULL REFERENCES shortlists(id) ON DELETE CASCADE,
      property_set_id INTEGER NOT NULL REFERENCES property_sets(id),
      position INTEGER NOT NULL,
      note TEXT NOT NULL DEFAULT '',
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      UNIQUE (shortlist_id, property_set_id)
    );

    -- A design record is written once, when a shortlist is checked, and never updated.
    CREATE TABLE design_records (
      id SERIAL PRIMARY KEY,
      shortlist_id INTEGER NOT NULL UNIQUE REFERENCES shortlists(id),
      project_id INTEGER NOT NULL REFERENCES projects(id),
      content JSONB NOT NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now()
    );
    CREATE INDEX design_records_project_idx ON design_records (project_id);

    CREATE TABLE invitations (
      id SERIAL PRIMARY KEY,
      email TEXT NOT NULL CHECK (email = lower(email)),
      role TEXT NOT NULL CHECK (role IN ('viewer','engineer','checker','librarian','admin')),
      token_hash TEXT NOT NULL UNIQUE,
      expires_at TIMESTAMPTZ NOT NULL,
      used_at TIMESTAMPTZ,
      invited_by_id INTEGER REFERENCES users(id),
      created_at TIMESTAMPTZ NOT NULL DEFAULT now()
    );

    CREATE TABLE password_resets (
      id SERIAL PRIMARY KEY,
      user_id INTEGER NOT NULL REFERENCES users(id),
      token_hash TEXT NOT NULL UNIQUE,
      expires_at TIMESTAMPTZ NOT NULL,
      used_at TIMESTAMPTZ,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now()
    );

    -- A frozen record is never changed or deleted, whatever the application does.
    CREATE FUNCTION refuse_record_change() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION 'design records are frozen: % refused', TG_OP USING ERRCODE = 'raise_exception';
    END $$;
    CREATE TRIGGER design_records_frozen BEFORE UPDATE OR DELETE ON design_records FOR EACH ROW EXECUTE FUNCTION refuse_record_change();
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP TABLE IF EXISTS password_resets, invitations, design_records, shortlist_items, shortlists, load_cases, project_members, projects CASCADE;
    DROP FUNCTION IF EXISTS refuse_record_change();
  `);
};

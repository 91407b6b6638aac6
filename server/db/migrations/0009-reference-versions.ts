import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// A citation in use changes only through review. Each version of a reference is a row of
// reference_versions, curated like a property set (draft → in review → published → retired, one
// open and one published version per reference). data_references keeps the content of the
// published version (its number in `version`), which is what drafts cite. A reference gets its
// first version row when something published first cites it; from then on it is not edited in
// place. Published and retired property sets and rating tables point at the version row they
// were approved with (reference_version_id), so a later version does not change them.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE data_references ADD COLUMN version INTEGER NOT NULL DEFAULT 1 CHECK (version >= 1);

    CREATE TABLE reference_versions (
      id SERIAL PRIMARY KEY,
      reference_id INTEGER NOT NULL REFERENCES data_references(id),
      version INTEGER NOT NULL CHECK (version >= 1),
      kind TEXT NOT NULL CHECK (kind IN ('standard','handbook','paper','test-report','supplier-data-sheet')),
      title TEXT NOT NULL,
      authors TEXT,
      year INTEGER,
      identifier TEXT,
      location TEXT,
      note TEXT,
      status TEXT NOT NULL DEFAULT 'draft' CHECK (status IN ('draft', 'in-review', 'published', 'retired')),
      lineage_id INTEGER,
      supersedes_id INTEGER REFERENCES reference_versions(id),
      superseded_by_id INTEGER REFERENCES reference_versions(id),
      drafted_by_id INTEGER REFERENCES users(id),
      last_edited_by_id INTEGER REFERENCES users(id),
      approved_by_id INTEGER REFERENCES users(id),
      returned_comment TEXT,
      submitted_at TIMESTAMPTZ,
      published_at TIMESTAMPTZ,
      retired_at TIMESTAMPTZ,
      lock_version INTEGER NOT NULL DEFAULT 0,
      created_at TIMESTAMPTZ NOT NULL,
      updated_at TIMESTAMPTZ NOT NULL,
      UNIQUE (reference_id, version),
      -- The target of the citing tables' (reference_id, reference_version_id) key.
      UNIQUE (reference_id, id)
    );
    CREATE UNIQUE INDEX reference_versions_one_open ON reference_versions (reference_id) WHERE status IN ('draft', 'in-review');
    CREATE UNIQUE INDEX reference_versions_one_published ON reference_versions (reference_id) WHERE status = 'published';
    CREATE INDEX reference_versions_status_idx ON reference_versions (status);

    -- Version 1 of every reference already in use: cited by a published or retired set or
    -- rating table, or by a design record.
    INSERT INTO reference_versions (reference_id, version, kind, title, authors, year, identifier, location, note,
                                    status, drafted_by_id, last_edited_by_id, published_at, created_at, updated_at)
    SELECT r.id, 1, r.kind, r.title, r.authors, r.year, r.identifier, r.location, r.note,
           'published', r.created_by_id, r.created_by_id, r.updated_at, now(), now()
    FROM data_references r
    WHERE EXISTS (SELECT 1 FROM property_sets p WHERE p.reference_id = r.id AND p.status IN ('published', 'retired'))
       OR EXISTS (SELECT 1 FROM rating_tables t WHERE t.reference_id = r.id AND t.status IN ('published', 'retired'))
       OR EXISTS (SELECT 1 FROM design_records d, jsonb_array_elements(d.content->'candidates') c
                  WHERE c->'propertySet'->'reference'->>'id' = r.id::text);
    UPDATE reference_versions SET lineage_id = id;

    ALTER TABLE property_sets
      ADD COLUMN reference_version_id INTEGER,
      ADD CONSTRAINT property_sets_cited_version_fk FOREIGN KEY (reference_id, reference_version_id) REFERENCES reference_versions (reference_id, id);
    UPDATE property_sets p SET reference_version_id = v.id
      FROM reference_versions v WHERE v.reference_id = p.reference_id AND p.status IN ('published', 'retired');
    ALTER TABLE property_sets ADD CONSTRAINT property_sets_published_cites_version
      CHECK (status IN ('draft', 'in-review') OR reference_id IS NULL OR reference_version_id IS NOT NULL);
    CREATE INDEX property_sets_reference_version_idx ON property_sets (reference_version_id);

    ALTER TABLE rating_tables
      ADD COLUMN reference_version_id INTEGER,
      ADD CONSTRAINT rating_tables_cited_version_fk FOREIGN KEY (reference_id, reference_version_id) REFERENCES reference_versions (reference_id, id);
    UPDATE rating_tables t SET reference_version_id = v.id
      FROM reference_versions v WHERE v.reference_id = t.reference_id AND t.status IN ('published', 'retired');
    ALTER TABLE rating_tables ADD CONSTRAINT rating_tables_published_cites_version
      CHECK (status IN ('draft', 'in-review') OR reference_id IS NULL OR reference_version_id IS NOT NULL);
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE rating_tables DROP CONSTRAINT IF EXISTS rating_tables_published_cites_version, DROP COLUMN IF EXISTS reference_version_id;
    ALTER TABLE property_sets DROP CONSTRAINT IF EXISTS property_sets_published_cites_version, DROP COLUMN IF EXISTS reference_version_id;
    DROP TABLE IF EXISTS reference_versions;
    ALTER TABLE data_references DROP COLUMN IF EXISTS version;
  `);
};

import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// Library desk: four-eyes review of property sets, optimistic locking on references, and the
// uploaded document of a reference (stored in the object store; the row keeps its key).
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE property_sets
      ADD COLUMN returned_comment TEXT,
      ADD COLUMN last_edited_by_id INTEGER REFERENCES users(id),
      ADD COLUMN submitted_at TIMESTAMPTZ;

    -- Older rows: the lineage of a set without one is the set itself.
    UPDATE property_sets SET lineage_id = id WHERE lineage_id IS NULL;

    -- One lineage has at most one open revision (draft or in review) and one published version.
    CREATE UNIQUE INDEX property_sets_one_open_per_lineage
      ON property_sets (lineage_id) WHERE status IN ('draft', 'in-review');
    CREATE UNIQUE INDEX property_sets_one_published_per_lineage
      ON property_sets (lineage_id) WHERE status = 'published';
    CREATE INDEX property_sets_drafted_by_idx ON property_sets (drafted_by_id);
    CREATE INDEX property_sets_last_edited_by_idx ON property_sets (last_edited_by_id);
    CREATE INDEX property_sets_reference_idx ON property_sets (reference_id);

    ALTER TABLE data_references
      ADD COLUMN document_key TEXT,
      ADD COLUMN document_name TEXT,
      ADD COLUMN document_size BIGINT CHECK (document_size IS NULL OR document_size >= 0),
      ADD COLUMN document_uploaded_at TIMESTAMPTZ,
      ADD COLUMN lock_version INTEGER NOT NULL DEFAULT 0,
      ADD CONSTRAINT data_references_document_complete CHECK (
        (document_key IS NULL AND document_name IS NULL AND document_size IS NULL AND document_uploaded_at IS NULL)
        OR (document_key IS NOT NULL AND document_name IS NOT NULL AND document_size IS NOT NULL AND document_uploaded_at IS NOT NULL)
      );
    CREATE UNIQUE INDEX data_references_document_key_idx ON data_references (document_key) WHERE document_key IS NOT NULL;

    -- Material names are matched case-insensitively (library desk, CSV import).
    CREATE UNIQUE INDEX materials_name_lower_idx ON materials (lower(name));

    CREATE INDEX audit_log_actor_idx ON audit_log (actor_id);
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    DROP INDEX IF EXISTS audit_log_actor_idx;
    DROP INDEX IF EXISTS materials_name_lower_idx;
    DROP INDEX IF EXISTS data_references_document_key_idx;
    ALTER TABLE data_references
      DROP CONSTRAINT IF EXISTS data_references_document_complete,
      DROP COLUMN IF EXISTS lock_version,
      DROP COLUMN IF EXISTS document_uploaded_at,
      DROP COLUMN IF EXISTS document_size,
      DROP COLUMN IF EXISTS document_name,
      DROP COLUMN IF EXISTS document_key;
    DROP INDEX IF EXISTS property_sets_reference_idx;
    DROP INDEX IF EXISTS property_sets_last_edited_by_idx;
    DROP INDEX IF EXISTS property_sets_drafted_by_idx;
    DROP INDEX IF EXISTS property_sets_one_published_per_lineage;
    DROP INDEX IF EXISTS property_sets_one_open_per_lineage;
    ALTER TABLE property_sets
      DROP COLUMN IF EXISTS submitted_at,
      DROP COLUMN IF EXISTS last_edited_by_id,
      DROP COLUMN IF EXISTS returned_comment;
  `);
};

import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// Documents are versioned, never deleted: every upload to a reference is a row here (its object
// in the store under its own key), numbered per reference. The document_* columns of
// data_references name the latest one, and document_version says which it is; a design record
// keeps the document version it was frozen with.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE reference_documents (
      id SERIAL PRIMARY KEY,
      reference_id INTEGER NOT NULL REFERENCES data_references(id),
      version INTEGER NOT NULL CHECK (version >= 1),
      storage_key TEXT NOT NULL UNIQUE,
      name TEXT NOT NULL,
      size BIGINT NOT NULL CHECK (size >= 0),
      uploaded_by_id INTEGER REFERENCES users(id),
      uploaded_at TIMESTAMPTZ NOT NULL,
      UNIQUE (reference_id, version)
    );

    INSERT INTO reference_documents (reference_id, version, storage_key, name, size, uploaded_at)
    SELECT id, 1, document_key, document_name, document_size, document_uploaded_at FROM data_references WHERE document_key IS NOT NULL;

    ALTER TABLE data_references ADD COLUMN document_version INTEGER;
    UPDATE data_references SET document_version = 1 WHERE document_key IS NOT NULL;
    ALTER TABLE data_references
      DROP CONSTRAINT data_references_document_complete,
      ADD CONSTRAINT data_references_document_complete CHECK (
        (document_key IS NULL AND document_name IS NULL AND document_size IS NULL AND document_uploaded_at IS NULL AND document_version IS NULL)
        OR (document_key IS NOT NULL AND document_name IS NOT NULL AND document_size IS NOT NULL AND document_uploaded_at IS NOT NULL AND document_version IS NOT NULL)
      ),
      ADD CONSTRAINT data_references_latest_document_fk FOREIGN KEY (id, document_version) REFERENCES reference_documents (reference_id, version);
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE data_references
      DROP CONSTRAINT IF EXISTS data_references_latest_document_fk,
      DROP CONSTRAINT IF EXISTS data_references_document_complete,
      DROP COLUMN IF EXISTS document_version,
      ADD CONSTRAINT data_references_document_complete CHECK (
        (document_key IS NULL AND document_name IS NULL AND document_size IS NULL AND document_uploaded_at IS NULL)
        OR (document_key IS NOT NULL AND document_name IS NOT NULL AND document_size IS NOT NULL AND document_uploaded_at IS NOT NULL)
      );
    DROP TABLE IF EXISTS reference_documents;
  `);
};

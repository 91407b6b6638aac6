import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// Rating tables: the trade's empirical window data (minimum t/Di or short-term critical
// pressure), cited and curated like property sets: one lineage of versions, four-eyes review,
// published ones never deleted. `covers_lineage_ids` names the property-set lineages of the
// material the table applies to (empty: every set of the material).
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE rating_tables (
      id SERIAL PRIMARY KEY,
      material_id INTEGER NOT NULL REFERENCES materials(id),
      reference_id INTEGER REFERENCES data_references(id),
      covers_lineage_ids INTEGER[] NOT NULL DEFAULT '{}',
      name TEXT NOT NULL,
      geometry TEXT NOT NULL CHECK (geometry IN ('flat-disc', 'conical-frustum', 'spherical-sector')),
      included_angle JSONB,
      limits JSONB,
      grade TEXT NOT NULL,
      note TEXT,
      data JSONB NOT NULL,
      status TEXT NOT NULL DEFAULT 'draft' CHECK (status IN ('draft', 'in-review', 'published', 'retired')),
      version INTEGER NOT NULL DEFAULT 1,
      lineage_id INTEGER,
      supersedes_id INTEGER REFERENCES rating_tables(id),
      superseded_by_id INTEGER REFERENCES rating_tables(id),
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
      CONSTRAINT rating_tables_published_cite CHECK (status IN ('draft', 'in-review') OR reference_id IS NOT NULL)
    );
    CREATE UNIQUE INDEX rating_tables_one_open_per_lineage ON rating_tables (lineage_id) WHERE status IN ('draft', 'in-review');
    CREATE UNIQUE INDEX rating_tables_one_published_per_lineage ON rating_tables (lineage_id) WHERE status = 'published';
    CREATE INDEX rating_tables_material_idx ON rating_tables (material_id);
    CREATE INDEX rating_tables_reference_idx ON rating_tables (reference_id);
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`DROP TABLE IF EXISTS rating_tables;`);
};

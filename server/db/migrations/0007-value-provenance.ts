import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// The status of each value of a property set (confirmed, recalled, derived, demo) with where it
// was confirmed and by whom: shared/schemas/provenance.ts. No entry means recalled.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE property_sets ADD COLUMN provenance JSONB NOT NULL DEFAULT '{}'::jsonb CHECK (jsonb_typeof(provenance) = 'object');`);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE property_sets DROP COLUMN IF EXISTS provenance;`);
};

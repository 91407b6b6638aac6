import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// A shortlist item's note is edited from a read: it carries a lock version, so a save made from
// an older read gets 409 instead of overwriting the newer note (projects have one since 0003).
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE shortlist_items ADD COLUMN lock_version INTEGER NOT NULL DEFAULT 0;`);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE shortlist_items DROP COLUMN IF EXISTS lock_version;`);
};

import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// What a submission froze (the load case as submitted, each candidate's set and result), so the
// checker reviews and the record freezes exactly that; and every round of submit → return/check.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE shortlists ADD COLUMN submission JSONB;
    ALTER TABLE shortlists ADD COLUMN rounds JSONB NOT NULL DEFAULT '[]'::jsonb CHECK (jsonb_typeof(rounds) = 'array');
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE shortlists DROP COLUMN IF EXISTS submission; ALTER TABLE shortlists DROP COLUMN IF EXISTS rounds;`);
};

import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

// A shear yield per property set (optional): shear allowables then sit on the same basis as
// tension and compression (metals without it get yield/√3 by von Mises in the calculation).
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE property_sets ADD COLUMN shear_yield DOUBLE PRECISION CHECK (shear_yield IS NULL OR shear_yield > 0);`);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE property_sets DROP COLUMN IF EXISTS shear_yield;`);
};

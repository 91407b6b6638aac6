import { env } from '../config/env';
import { initModels } from './models';
import { migrate } from './migrate';
import { sequelize } from './sequelize';
import { seedCatalogue } from './seeders/catalogue';
import { seedDemoUsers } from './seeders/demo';
import { invalidateCatalogueSnapshot } from '../modules/property-sets/snapshot';

export interface SetupResult {
  migrations: string[];
  propertySets: number;
  demoUsers: number;
}

/**
 * Migrate, then seed the catalogue (on an empty database) and, outside production, the
 * demo accounts. Idempotent: a second run changes nothing. One transaction for the seed.
 */
export async function setupDatabase(options: { demo?: boolean } = {}): Promise<SetupResult> {
  initModels();
  const migrations = await migrate();
  const demo = options.demo ?? (env().NODE_ENV !== 'production' && process.env.ISOBATH_DEMO !== 'false');
  return sequelize().transaction(async (transaction) => {
    const propertySets = await seedCatalogue(transaction);
    const demoUsers = demo ? await seedDemoUsers(transaction) : 0;
    return { migrations, propertySets, demoUsers };
  });
}

const TABLES = ['audit_log', 'session', 'property_sets', 'data_references', 'materials', 'users'];

/** Tests only: empty every table, then seed again. */
export async function resetDatabase(): Promise<SetupResult> {
  if (env().NODE_ENV !== 'test') throw new Error('resetDatabase is for tests only');
  initModels();
  await migrate();
  await sequelize().query(`TRUNCATE ${TABLES.join(', ')} RESTART IDENTITY CASCADE`);
  invalidateCatalogueSnapshot();
  return setupDatabase({ demo: true });
}

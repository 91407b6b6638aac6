import { env } from '../config/env';
import { initModels } from './models';
import { migrate } from './migrate';
import { sequelize } from './sequelize';
import { seedCatalogue, seedRatingTables } from './seeders/catalogue';
import { seedDemoUsers } from './seeders/demo';
import { seedDemoProject } from './seeders/demo-project';
import { invalidateCatalogueSnapshot } from '../modules/property-sets/snapshot';
import { forgetSessionUsers } from '../auth/passport';
import { forgetAllSessions } from '../auth/session-cache';

export interface SetupResult {
  migrations: string[];
  propertySets: number;
  demoUsers: number;
  demoProject: boolean;
}

/**
 * Migrate, then seed the catalogue (on an empty database) and, outside production, the
 * demo accounts. Idempotent: a second run changes nothing. One transaction for the seed.
 */
export async function setupDatabase(options: { demo?: boolean; demoProject?: boolean } = {}): Promise<SetupResult> {
  initModels();
  const migrations = await migrate();
  const demo = options.demo ?? (env().NODE_ENV !== 'production' && process.env.ISOBATH_DEMO !== 'false');
  const seeded = await sequelize().transaction(async (transaction) => {
    const propertySets = await seedCatalogue(transaction);
    await seedRatingTables(transaction);
    const demoUsers = demo ? await seedDemoUsers(transaction) : 0;
    return { migrations, propertySets, demoUsers };
  });
  // The demo project goes through the projects services (each step its own transaction),
  // so its design record is a real one.
  const demoProject = demo && (options.demoProject ?? true) ? await seedDemoProject() : false;
  return { ...seeded, demoProject };
}

/** Every application table, in an order TRUNCATE … CASCADE accepts. */
export const TABLES = [
  'sign_in_throttles',
  'mail_outbox',
  'audit_log',
  'value_confirmations',
  'session',
  'password_resets',
  'invitations',
  'design_records',
  'shortlist_items',
  'shortlists',
  'load_cases',
  'project_members',
  'projects',
  'rating_tables',
  'property_sets',
  'reference_documents',
  'reference_versions',
  'data_references',
  'materials',
  'users',
];

/** Migrates, empties every table and forgets what this process holds in memory about them. */
export async function emptyDatabase(): Promise<void> {
  initModels();
  await migrate();
  await sequelize().query(`TRUNCATE ${TABLES.join(', ')} RESTART IDENTITY CASCADE`);
  invalidateCatalogueSnapshot();
  forgetSessionUsers();
  forgetAllSessions();
}

/** Tests only: empty every table, then seed the catalogue and demo accounts (and, when asked, the demo project). */
export async function resetDatabase(options: { demoProject?: boolean } = {}): Promise<SetupResult> {
  if (env().NODE_ENV !== 'test') throw new Error('resetDatabase is for tests only');
  await emptyDatabase();
  return setupDatabase({ demo: true, demoProject: options.demoProject ?? false });
}

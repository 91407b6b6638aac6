import { Umzug, SequelizeStorage } from 'umzug';
import type { QueryInterface } from 'sequelize';
import { sequelize } from './sequelize';
import * as m0001 from './migrations/0001-initial';
import * as m0002 from './migrations/0002-library-desk';
import * as m0003 from './migrations/0003-projects';
import * as m0004 from './migrations/0004-rating-tables';
import * as m0005 from './migrations/0005-shear-yield';
import * as m0006 from './migrations/0006-shortlist-rounds';
import * as m0007 from './migrations/0007-value-provenance';
import * as m0008 from './migrations/0008-value-confirmations';
import * as m0009 from './migrations/0009-reference-versions';
import * as m0010 from './migrations/0010-reference-documents';
import * as m0011 from './migrations/0011-sign-in-throttle';
import * as m0012 from './migrations/0012-mail-outbox';
import * as m0013 from './migrations/0013-item-versions';

// Listed explicitly: vitest cannot glob-load .ts migrations. Add new ones at the end.
const MIGRATIONS = [
  { name: '0001-initial', ...m0001 },
  { name: '0002-library-desk', ...m0002 },
  { name: '0003-projects', ...m0003 },
  { name: '0004-rating-tables', ...m0004 },
  { name: '0005-shear-yield', ...m0005 },
  { name: '0006-shortlist-rounds', ...m0006 },
  { name: '0007-value-provenance', ...m0007 },
  { name: '0008-value-confirmations', ...m0008 },
  { name: '0009-reference-versions', ...m0009 },
  { name: '0010-reference-documents', ...m0010 },
  { name: '0011-sign-in-throttle', ...m0011 },
  { name: '0012-mail-outbox', ...m0012 },
  { name: '0013-item-versions', ...m0013 },
];

export function migrator() {
  const db = sequelize();
  return new Umzug<QueryInterface>({
    migrations: MIGRATIONS.map((m) => ({ name: m.name, up: m.up, down: m.down })),
    context: db.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize: db, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

/** Apply pending migrations; returns the names applied. */
export async function migrate(): Promise<string[]> {
  const done = await migrator().up();
  return done.map((m) => m.name);
}

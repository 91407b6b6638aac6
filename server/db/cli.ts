import { setupDatabase } from './setup';
import { migrate } from './migrate';
import { closeDatabase } from './sequelize';
import { initModels } from './models';
import { settleOutbox } from '../services/outbox';

const command = process.argv[2] ?? 'setup';

async function main() {
  initModels();
  if (command === 'migrate') {
    const done = await migrate();
    console.log(`[isobath] migrations applied: ${done.length ? done.join(', ') : 'none pending'}`);
  } else if (command === 'setup' || command === 'seed') {
    const r = await setupDatabase();
    console.log(
      `[isobath] database ready: ${r.migrations.length} migration(s) applied, ${r.propertySets} property set(s) and ${r.demoUsers} demo account(s) seeded${r.demoProject ? ', Harrow Sound demo projects created' : ''}`,
    );
  } else {
    console.error('usage: tsx server/db/cli.ts setup|migrate|seed');
    process.exitCode = 2;
  }
}

main()
  .catch((err) => {
    console.error('[isobath] database setup failed:', err instanceof Error ? err.message : err);
    process.exitCode = 1;
  })
  // Mail the seed queued and is still sending finishes first (what is left, the server's worker sends).
  .finally(() => settleOutbox().then(() => closeDatabase()));

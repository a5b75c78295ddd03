// Runs migrations explicitly: `node apps/api/dist/database/migrate.js up|down|status`.
import { DataSource } from 'typeorm';
import { dataSourceOptions } from './data-source';

async function main(): Promise<void> {
  const command = process.argv[2] ?? 'up';
  if (!['up', 'down', 'status'].includes(command)) {
    console.error(`Usage: migrate.js up|down|status (got "${command}")`);
    process.exit(2);
  }
  const ds = new DataSource({ ...dataSourceOptions, logging: ['error'] });
  await ds.initialize();
  try {
    if (command === 'up') {
      const done = await ds.runMigrations({ transaction: 'each' });
      console.log(done.length ? `Applied ${done.length} migration${done.length === 1 ? '' : 's'}: ${done.map((m) => m.name).join(', ')}` : 'Database schema is up to date.');
    } else if (command === 'down') {
      await ds.undoLastMigration({ transaction: 'each' });
      console.log('Reverted the last migration.');
    } else {
      const pending = await ds.showMigrations();
      console.log(pending ? 'Some migrations are pending.' : 'No pending migrations.');
    }
  } finally {
    await ds.destroy();
  }
}

main().catch((err: unknown) => {
  console.error(`Migration failed: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});

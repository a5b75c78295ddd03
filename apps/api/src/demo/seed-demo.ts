// Loads the demo scenario from seeds-demo/ (idempotent): `node apps/api/dist/demo/seed-demo.js`.
// Each step is a function of the DataSource; features add their step to STEPS (users first).
import 'reflect-metadata';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { DataSource } from 'typeorm';
import { dataSourceOptions } from '../database/data-source';
import { DemoUser, seedDemoUsers } from './seed-users';
import { DemoNotebookManifest, seedDemoNotebooks, seedStoredLevels } from './seed-notebooks';

/** seeds-demo/ at the repository root (same depth from src/demo and dist/demo). */
export const SEEDS_DIR = join(__dirname, '..', '..', '..', '..', 'seeds-demo');

export function readSeedJson<T>(file: string): T {
  return JSON.parse(readFileSync(join(SEEDS_DIR, file), 'utf8')) as T;
}

type Step = { name: string; run: (ds: DataSource) => Promise<string> };

const STEPS: Step[] = [
  {
    name: 'users',
    run: async (ds) => {
      const { users } = readSeedJson<{ users: DemoUser[] }>('users.json');
      const { created } = await seedDemoUsers(ds, users);
      return created.length ? `created ${created.length} account${created.length === 1 ? '' : 's'}` : 'all accounts present';
    },
  },
  {
    name: 'notebooks',
    run: async (ds) => {
      const created = await seedDemoNotebooks(ds, SEEDS_DIR, readSeedJson<DemoNotebookManifest>('notebooks.json'));
      return created.length ? `created ${created.map((t) => `"${t}"`).join(', ')}` : 'all notebooks present';
    },
  },
  {
    name: 'stored levels',
    run: async (ds) => {
      const n = await seedStoredLevels(ds, String((ds.options as { url?: string }).url));
      return n ? `queued ${n} wheel level(s) up to 23# for the runners` : 'levels up to 23# stored or queued';
    },
  },
];

async function main(): Promise<void> {
  const ds = new DataSource({ ...dataSourceOptions, logging: ['error'] });
  await ds.initialize();
  try {
    for (const step of STEPS) console.log(`demo ${step.name}: ${await step.run(ds)}`);
  } finally {
    await ds.destroy();
  }
}

if (require.main === module) {
  main().catch((err: unknown) => {
    console.error(`Loading the demo data failed: ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  });
}

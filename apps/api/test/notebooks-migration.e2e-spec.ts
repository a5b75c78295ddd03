import { randomBytes } from 'node:crypto';
import { Client as PgClient } from 'pg';
import { DataSource } from 'typeorm';
import { makeDataSourceOptions } from '../src/database/data-source';

/** The notebooks migration on an empty database: its tables, functions and triggers come and go. */
describe('notebooks migration', () => {
  const base = new URL(process.env.DATABASE_OWNER_URL ?? process.env.DATABASE_URL!);
  const name = `cribra_nbmig_${randomBytes(4).toString('hex')}`;
  const admin = new PgClient({ connectionString: Object.assign(new URL(base), { pathname: '/postgres' }).toString() });

  beforeAll(async () => {
    await admin.connect();
    await admin.query(`CREATE DATABASE ${name}`);
  });
  afterAll(async () => {
    await admin.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
    await admin.end();
  });

  it('creates the notebook tables, notify triggers and search column, and drops them all again', async () => {
    const ds = new DataSource({ ...makeDataSourceOptions(Object.assign(new URL(base), { pathname: `/${name}` }).toString()), logging: ['error'] });
    await ds.initialize();
    const functions = async () =>
      (await ds.query(`SELECT proname FROM pg_proc WHERE proname LIKE 'cribra_%' AND proname NOT LIKE 'cribra_guard%' ORDER BY 1`)).map(
        (r: { proname: string }) => r.proname,
      );
    try {
      const applied = await ds.runMigrations({ transaction: 'each' });
      expect(applied.map((m) => m.name)).toContain('NotebooksAndRuns1796100000000');
      // (cribra_notebook_state_notify: the live-state triggers of 1797300000000.)
      expect(await functions()).toEqual(['cribra_notebook_state_notify', 'cribra_notebooks_notify', 'cribra_runs_notify', 'cribra_tags_text']);
      // The generated search column and its index answer a full-text query.
      const [u] = await ds.query(`INSERT INTO users (email, display_name, password_hash) VALUES ('m@test.example', 'M', 'x') RETURNING id`);
      await ds.query(`INSERT INTO notebooks (title, summary, tags, owner_id) VALUES ('Wheel gaps', 'about sieves', '{jacobsthal}', $1)`, [u.id]);
      const hits = await ds.query(`SELECT title FROM notebooks WHERE search @@ websearch_to_tsquery('simple', 'jacobsthal sieves')`);
      expect(hits).toEqual([{ title: 'Wheel gaps' }]);
      await ds.query(`DELETE FROM notebooks`);
      await ds.query(`DELETE FROM users`);
      for (let i = 0; i < applied.length; i++) await ds.undoLastMigration({ transaction: 'each' });
      expect(await functions()).toEqual([]);
      const [{ n }] = await ds.query(`SELECT count(*)::int AS n FROM information_schema.tables WHERE table_schema = 'public' AND table_name <> 'migrations'`);
      expect(n).toBe(0);
    } finally {
      await ds.destroy();
    }
  });
});

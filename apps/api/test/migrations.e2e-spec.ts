import { randomBytes } from 'node:crypto';
import { Client as PgClient } from 'pg';
import { DataSource } from 'typeorm';
import { makeDataSourceOptions } from '../src/database/data-source';

/** Every migration (all features) must apply to an empty database and revert to an empty one. */
describe('migrations on an empty database', () => {
  const base = new URL(process.env.DATABASE_OWNER_URL ?? process.env.DATABASE_URL!);
  const name = `cribra_migrations_${randomBytes(4).toString('hex')}`;
  const admin = new PgClient({ connectionString: Object.assign(new URL(base), { pathname: '/postgres' }).toString() });
  const url = Object.assign(new URL(base), { pathname: `/${name}` }).toString();

  beforeAll(async () => {
    await admin.connect();
    await admin.query(`CREATE DATABASE ${name}`);
  });
  afterAll(async () => {
    await admin.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
    await admin.end();
  });

  const tables = async (ds: DataSource): Promise<string[]> =>
    (await ds.query(`SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' ORDER BY 1`)).map(
      (r: { table_name: string }) => r.table_name,
    );

  it('runs every migration up, then every one down, leaving only the bookkeeping table', async () => {
    const ds = new DataSource({ ...makeDataSourceOptions(url), logging: ['error'] });
    await ds.initialize();
    try {
      const applied = await ds.runMigrations({ transaction: 'each' });
      expect(applied.length).toBeGreaterThanOrEqual(1);
      expect(applied[0].name).toBe('UsersAndSessions1796000000000');
      expect(await tables(ds)).toEqual(expect.arrayContaining(['users', 'session', 'password_resets', 'migrations']));
      expect(await ds.showMigrations()).toBe(false);

      for (let i = 0; i < applied.length; i++) await ds.undoLastMigration({ transaction: 'each' });
      expect(await tables(ds)).toEqual(['migrations']);
      expect(await ds.query('SELECT count(*)::int AS n FROM migrations')).toEqual([{ n: 0 }]);

      // and up again: down() really undid everything
      expect((await ds.runMigrations({ transaction: 'each' })).length).toBe(applied.length);
    } finally {
      await ds.destroy();
    }
  });
});

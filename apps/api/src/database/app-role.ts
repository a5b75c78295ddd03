// Creates (or refreshes) the database role the API and runners connect as:
// `DATABASE_URL=<owner url> node apps/api/dist/database/app-role.js [role]` after the migrations.
// The role may read and write rows but owns no table and is no superuser, so the lock triggers
// bind it (it cannot drop or disable them, TRUNCATE, or `SET session_replication_role`); the
// escape hatch `cribra.allow_locked_changes` is honoured only for a table's owner (migrations).
import 'reflect-metadata';
import PgBoss from 'pg-boss';
import { Client } from 'pg';
import { ensureQueues } from '../queue/queue.service';

export const DEFAULT_APP_ROLE = 'cribra_app';

/**
 * The statements, run by the owner of the schema (they also hold for tables other features add
 * later: the schema-wide grants are re-applied on every start and default privileges cover new
 * tables created by the owner).
 */
export function appRoleStatements(role: string, database: string): string[] {
  if (!/^[a-z_][a-z0-9_]*$/.test(role)) throw new Error(`Role name "${role}" must be lower-case letters, digits and _`);
  const schemas = 'public, pgboss';
  return [
    `DO $$ BEGIN
       IF NOT EXISTS (SELECT 1 FROM pg_roles WHERE rolname = '${role}') THEN
         CREATE ROLE ${role} LOGIN NOSUPERUSER NOCREATEDB NOCREATEROLE NOREPLICATION NOBYPASSRLS;
       END IF;
     END $$`,
    `ALTER ROLE ${role} NOSUPERUSER NOCREATEDB NOCREATEROLE NOREPLICATION NOBYPASSRLS`,
    `GRANT CONNECT, TEMPORARY ON DATABASE "${database}" TO ${role}`,
    `REVOKE CREATE ON SCHEMA public FROM ${role}`,
    `GRANT USAGE ON SCHEMA ${schemas} TO ${role}`,
    // No TRUNCATE, REFERENCES or TRIGGER: rows only.
    `GRANT SELECT, INSERT, UPDATE, DELETE ON ALL TABLES IN SCHEMA ${schemas} TO ${role}`,
    `GRANT USAGE, SELECT, UPDATE ON ALL SEQUENCES IN SCHEMA ${schemas} TO ${role}`,
    `GRANT EXECUTE ON ALL FUNCTIONS IN SCHEMA ${schemas} TO ${role}`,
    `ALTER DEFAULT PRIVILEGES IN SCHEMA public GRANT SELECT, INSERT, UPDATE, DELETE ON TABLES TO ${role}`,
    `ALTER DEFAULT PRIVILEGES IN SCHEMA public GRANT USAGE, SELECT, UPDATE ON SEQUENCES TO ${role}`,
    `ALTER DEFAULT PRIVILEGES IN SCHEMA pgboss GRANT SELECT, INSERT, UPDATE, DELETE ON TABLES TO ${role}`,
    `ALTER DEFAULT PRIVILEGES IN SCHEMA pgboss GRANT USAGE, SELECT, UPDATE ON SEQUENCES TO ${role}`,
  ];
}

/** pg-boss's schema and our queues, created by the owner (a queue is a partition table). */
async function installQueues(url: string): Promise<void> {
  const boss = new PgBoss({ connectionString: url, schema: 'pgboss', supervise: false, schedule: false, max: 2 });
  await boss.start();
  try {
    await ensureQueues(boss);
  } finally {
    await boss.stop({ graceful: false, close: true, wait: true });
  }
}

export async function setUpAppRole(ownerUrl: string, role = DEFAULT_APP_ROLE): Promise<void> {
  await installQueues(ownerUrl);
  const client = new Client({ connectionString: ownerUrl });
  await client.connect();
  try {
    const [{ db }] = (await client.query(`SELECT current_database() AS db`)).rows;
    for (const sql of appRoleStatements(role, db)) await client.query(sql);
  } finally {
    await client.end();
  }
}

if (require.main === module) {
  const url = process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:4311/cribra';
  const role = process.argv[2] ?? process.env.CRIBRA_APP_ROLE ?? DEFAULT_APP_ROLE;
  setUpAppRole(url, role)
    .then(() => console.log(`Database role ${role}: rows of every table, no ownership, no superuser.`))
    .catch((err: unknown) => {
      console.error(`Setting up the database role failed: ${err instanceof Error ? err.message : String(err)}`);
      process.exit(1);
    });
}

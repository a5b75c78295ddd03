import { Client as PgClient } from 'pg';

/**
 * Runs the statements in order on a plain connection as the app's own role (DATABASE_URL, what the
 * API and runners use — as a person with psql would) and returns the SQLSTATE the first refusal had.
 * @throws when every statement went through.
 */
export async function sqlStateAsApp(statements: Array<[string, unknown[]?]>): Promise<string> {
  const pg = new PgClient({ connectionString: process.env.DATABASE_URL });
  await pg.connect();
  try {
    for (const [sql, params] of statements) await pg.query(sql, params ?? []);
  } catch (e) {
    return (e as { code?: string }).code ?? 'no code';
  } finally {
    await pg.end();
  }
  throw new Error(`expected the database to refuse: ${statements.map((s) => s[0]).join('; ')}`);
}

/** One statement as {@link sqlStateAsApp}. */
export const sqlFails = (sql: string, params: unknown[]): Promise<string> => sqlStateAsApp([[sql, params]]);

/**
 * Runs SQL as the tables' owner (DATABASE_OWNER_URL, what migrations use) in one transaction with
 * the lock trigger's maintenance escape on, which the app's role may not use.
 */
export async function asOwner<T = Record<string, unknown>>(sql: string, params: unknown[] = []): Promise<T[]> {
  const pg = new PgClient({ connectionString: process.env.DATABASE_OWNER_URL ?? process.env.DATABASE_URL });
  await pg.connect();
  try {
    await pg.query('BEGIN');
    await pg.query(`SET LOCAL cribra.allow_locked_changes = 'on'`);
    const { rows } = await pg.query(sql, params);
    await pg.query('COMMIT');
    return rows as T[];
  } finally {
    await pg.end();
  }
}

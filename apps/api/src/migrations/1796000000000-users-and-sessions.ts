import { MigrationInterface, QueryRunner } from 'typeorm';

/** Users with site roles, the express-session table (connect-pg-simple layout) and reset tokens. */
export class UsersAndSessions1796000000000 implements MigrationInterface {
  name = 'UsersAndSessions1796000000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE users (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        email varchar(320) NOT NULL,
        display_name varchar(120) NOT NULL,
        password_hash text NOT NULL,
        site_role varchar(16) NOT NULL DEFAULT 'member' CHECK (site_role IN ('admin', 'member')),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    // E-mails are stored lower-cased; the index also guards against mixed-case duplicates.
    await q.query(`CREATE UNIQUE INDEX users_email_key ON users (lower(email))`);
    await q.query(`
      CREATE TABLE session (
        sid varchar NOT NULL COLLATE "default" PRIMARY KEY,
        sess json NOT NULL,
        expire timestamp(6) NOT NULL
      )`);
    await q.query(`CREATE INDEX session_expire_idx ON session (expire)`);
    await q.query(`
      CREATE TABLE password_resets (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
        token_hash char(64) NOT NULL UNIQUE,
        expires_at timestamptz NOT NULL,
        used_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX password_resets_user_idx ON password_resets (user_id)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE password_resets`);
    await q.query(`DROP TABLE session`);
    await q.query(`DROP TABLE users`);
  }
}

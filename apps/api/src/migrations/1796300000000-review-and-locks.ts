import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Invitations, comment threads, re-verifications, reviews (sign-offs), review requests and lock
 * records, plus the trigger that freezes a locked notebook in the database itself:
 * UPDATE and DELETE (and INSERT, except re-verification runs) on a locked notebook's cells, runs,
 * reviews, lock record and its own row raise SQLSTATE 'CRLCK'.
 *
 * Escape hatch for maintenance and test teardown only: inside a transaction,
 * `SET LOCAL cribra.allow_locked_changes = 'on'` lets the statements through (the API never sets it).
 * Re-verification runs inserted after the lock (a lock check) may be updated by runners: they are
 * not part of the frozen record.
 */
export class ReviewAndLocks1796300000000 implements MigrationInterface {
  name = 'ReviewAndLocks1796300000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE invitations (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        notebook_id uuid NOT NULL REFERENCES notebooks (id) ON DELETE CASCADE,
        email varchar(320) NOT NULL,
        role varchar(16) NOT NULL CHECK (role IN ('editor', 'reviewer', 'viewer')),
        message text NOT NULL DEFAULT '',
        token_hash char(64) NOT NULL UNIQUE,
        invited_by uuid NOT NULL REFERENCES users (id),
        created_at timestamptz NOT NULL DEFAULT now(),
        expires_at timestamptz NOT NULL,
        accepted_at timestamptz,
        accepted_by uuid REFERENCES users (id) ON DELETE SET NULL,
        revoked_at timestamptz,
        delivery varchar(16) NOT NULL DEFAULT 'sending' CHECK (delivery IN ('sending', 'sent', 'retrying', 'failed')),
        delivery_attempts int NOT NULL DEFAULT 0,
        delivery_error text,
        next_attempt_at timestamptz,
        sent_at timestamptz
      )`);
    await q.query(`CREATE INDEX invitations_notebook_idx ON invitations (notebook_id, created_at DESC)`);
    await q.query(`
      CREATE INDEX invitations_due_idx ON invitations (next_attempt_at)
      WHERE delivery IN ('sending', 'retrying') AND accepted_at IS NULL AND revoked_at IS NULL`);

    await q.query(`
      CREATE TABLE comment_threads (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        notebook_id uuid NOT NULL REFERENCES notebooks (id) ON DELETE CASCADE,
        anchor_kind varchar(8) NOT NULL CHECK (anchor_kind IN ('notebook', 'cell', 'output')),
        cell_id uuid REFERENCES cells (id) ON DELETE CASCADE,
        run_id uuid REFERENCES runs (id) ON DELETE SET NULL,
        output_index int CHECK (output_index >= 0),
        status varchar(8) NOT NULL DEFAULT 'open' CHECK (status IN ('open', 'resolved')),
        created_by uuid NOT NULL REFERENCES users (id),
        created_at timestamptz NOT NULL DEFAULT now(),
        resolved_by uuid REFERENCES users (id) ON DELETE SET NULL,
        resolved_at timestamptz,
        CHECK ((anchor_kind = 'notebook') = (cell_id IS NULL)),
        CHECK ((anchor_kind = 'output') = (output_index IS NOT NULL))
      )`);
    await q.query(`CREATE INDEX comment_threads_notebook_idx ON comment_threads (notebook_id, created_at)`);
    await q.query(`CREATE INDEX comment_threads_cell_idx ON comment_threads (cell_id) WHERE cell_id IS NOT NULL`);
    await q.query(`
      CREATE TABLE comments (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        thread_id uuid NOT NULL REFERENCES comment_threads (id) ON DELETE CASCADE,
        author_id uuid NOT NULL REFERENCES users (id),
        body text NOT NULL,
        mentions uuid[] NOT NULL DEFAULT '{}',
        created_at timestamptz NOT NULL DEFAULT now(),
        edited_at timestamptz
      )`);
    await q.query(`CREATE INDEX comments_thread_idx ON comments (thread_id, created_at)`);

    await q.query(`
      CREATE TABLE review_requests (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        notebook_id uuid NOT NULL REFERENCES notebooks (id) ON DELETE CASCADE,
        requested_by uuid NOT NULL REFERENCES users (id),
        message text NOT NULL DEFAULT '',
        requested_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX review_requests_notebook_idx ON review_requests (notebook_id, requested_at DESC)`);

    await q.query(`
      CREATE TABLE verifications (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        notebook_id uuid NOT NULL REFERENCES notebooks (id) ON DELETE CASCADE,
        purpose varchar(8) NOT NULL CHECK (purpose IN ('review', 'lock')),
        revision_digest char(64) NOT NULL,
        requested_by uuid NOT NULL REFERENCES users (id),
        created_at timestamptz NOT NULL DEFAULT now(),
        finished_at timestamptz
      )`);
    await q.query(`CREATE INDEX verifications_notebook_idx ON verifications (notebook_id, created_at DESC)`);
    await q.query(`
      CREATE TABLE verification_cells (
        verification_id uuid NOT NULL REFERENCES verifications (id) ON DELETE CASCADE,
        cell_id uuid NOT NULL,
        position int NOT NULL,
        kind varchar(8) NOT NULL,
        recorded_run_id uuid,
        recorded_digest varchar(128),
        run_id uuid REFERENCES runs (id) ON DELETE SET NULL,
        PRIMARY KEY (verification_id, cell_id)
      )`);

    await q.query(`
      CREATE TABLE reviews (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        notebook_id uuid NOT NULL REFERENCES notebooks (id) ON DELETE CASCADE,
        reviewer_id uuid NOT NULL REFERENCES users (id),
        decision varchar(20) NOT NULL CHECK (decision IN ('signoff', 'changes_requested')),
        comment text NOT NULL,
        revision_digest char(64) NOT NULL,
        notebook_revision int NOT NULL,
        verification_id uuid REFERENCES verifications (id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        voided_at timestamptz,
        void_reason text
      )`);
    await q.query(`CREATE INDEX reviews_notebook_idx ON reviews (notebook_id, created_at DESC)`);
    await q.query(`
      CREATE INDEX reviews_active_signoffs_idx ON reviews (notebook_id)
      WHERE decision = 'signoff' AND voided_at IS NULL`);

    await q.query(`
      CREATE TABLE notebook_locks (
        notebook_id uuid PRIMARY KEY REFERENCES notebooks (id) ON DELETE CASCADE,
        locked_by uuid NOT NULL REFERENCES users (id),
        locked_at timestamptz NOT NULL DEFAULT now(),
        revision_digest char(64) NOT NULL,
        notebook_revision int NOT NULL,
        record jsonb NOT NULL
      )`);

    await q.query(`
      CREATE FUNCTION cribra_guard_locked() RETURNS trigger LANGUAGE plpgsql AS $$
      DECLARE
        row_data record;
        nb_status varchar;
        locked timestamptz;
      BEGIN
        IF coalesce(current_setting('cribra.allow_locked_changes', true), '') = 'on' THEN
          IF TG_OP = 'DELETE' THEN RETURN OLD; END IF;
          RETURN NEW;
        END IF;
        IF TG_OP = 'INSERT' THEN row_data := NEW; ELSE row_data := OLD; END IF;
        SELECT status INTO nb_status FROM notebooks WHERE id = row_data.notebook_id;
        IF nb_status = 'locked' THEN
          -- Lock checks insert re-verification runs after the lock; runners must update them.
          -- (nested IFs: a record field is only read when the table has it)
          IF TG_TABLE_NAME = 'runs' THEN
            IF row_data.purpose = 'reverify' THEN
              SELECT locked_at INTO locked FROM notebook_locks WHERE notebook_id = row_data.notebook_id;
              IF TG_OP = 'INSERT' OR row_data.queued_at > locked THEN
                IF TG_OP = 'DELETE' THEN RETURN OLD; END IF;
                RETURN NEW;
              END IF;
            END IF;
          END IF;
          RAISE EXCEPTION 'notebook % is locked: % on % refused', row_data.notebook_id, TG_OP, TG_TABLE_NAME
            USING ERRCODE = 'CRLCK', HINT = 'Duplicate the notebook to make changes.';
        END IF;
        IF TG_OP = 'DELETE' THEN RETURN OLD; END IF;
        RETURN NEW;
      END $$`);
    // The notebook row itself: only once it IS locked (the lock itself is an UPDATE from in_review).
    await q.query(`
      CREATE FUNCTION cribra_guard_locked_notebook() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF OLD.status = 'locked' AND coalesce(current_setting('cribra.allow_locked_changes', true), '') <> 'on' THEN
          RAISE EXCEPTION 'notebook % is locked: % refused', OLD.id, TG_OP
            USING ERRCODE = 'CRLCK', HINT = 'Duplicate the notebook to make changes.';
        END IF;
        IF TG_OP = 'DELETE' THEN RETURN OLD; END IF;
        RETURN NEW;
      END $$`);
    await q.query(`
      CREATE TRIGGER notebooks_guard_locked BEFORE UPDATE OR DELETE ON notebooks
      FOR EACH ROW EXECUTE FUNCTION cribra_guard_locked_notebook()`);
    for (const table of ['cells', 'runs', 'reviews', 'notebook_locks']) {
      await q.query(`
        CREATE TRIGGER ${table}_guard_locked BEFORE INSERT OR UPDATE OR DELETE ON ${table}
        FOR EACH ROW EXECUTE FUNCTION cribra_guard_locked()`);
    }
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of ['cells', 'runs', 'reviews', 'notebook_locks']) {
      await q.query(`DROP TRIGGER ${table}_guard_locked ON ${table}`);
    }
    await q.query(`DROP TRIGGER notebooks_guard_locked ON notebooks`);
    await q.query(`DROP FUNCTION cribra_guard_locked_notebook()`);
    await q.query(`DROP FUNCTION cribra_guard_locked()`);
    await q.query(`DROP TABLE notebook_locks`);
    await q.query(`DROP TABLE reviews`);
    await q.query(`DROP TABLE verification_cells`);
    await q.query(`DROP TABLE verifications`);
    await q.query(`DROP TABLE review_requests`);
    await q.query(`DROP TABLE comments`);
    await q.query(`DROP TABLE comment_threads`);
    await q.query(`DROP TABLE invitations`);
  }
}

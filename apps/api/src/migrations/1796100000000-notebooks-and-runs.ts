import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Notebooks, members, cells, runs, chunked computations, stored wheel levels, prime ledger
 * blocks, uploads, audit events and runner heartbeats. A trigger on `runs` announces every change
 * on the channel `cribra_runs` so that API processes can stream progress (server-sent events).
 */
export class NotebooksAndRuns1796100000000 implements MigrationInterface {
  name = 'NotebooksAndRuns1796100000000';

  async up(q: QueryRunner): Promise<void> {
    // array_to_string is only STABLE; a generated column needs an IMMUTABLE expression.
    await q.query(`
      CREATE FUNCTION cribra_tags_text(tags text[]) RETURNS text
      LANGUAGE sql IMMUTABLE PARALLEL SAFE AS $$ SELECT coalesce(array_to_string(tags, ' '), '') $$`);
    await q.query(`
      CREATE TABLE notebooks (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        title varchar(200) NOT NULL,
        summary text NOT NULL DEFAULT '',
        tags text[] NOT NULL DEFAULT '{}',
        owner_id uuid NOT NULL REFERENCES users (id),
        status varchar(16) NOT NULL DEFAULT 'draft' CHECK (status IN ('draft', 'in_review', 'locked')),
        revision int NOT NULL DEFAULT 1 CHECK (revision >= 1),
        required_signoffs int NOT NULL DEFAULT 1 CHECK (required_signoffs BETWEEN 1 AND 20),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        search tsvector GENERATED ALWAYS AS (
          setweight(to_tsvector('simple', title), 'A') ||
          setweight(to_tsvector('simple', cribra_tags_text(tags)), 'A') ||
          setweight(to_tsvector('simple', summary), 'B')
        ) STORED
      )`);
    await q.query(`CREATE INDEX notebooks_search_idx ON notebooks USING gin (search)`);
    await q.query(`CREATE INDEX notebooks_tags_idx ON notebooks USING gin (tags)`);
    await q.query(`CREATE INDEX notebooks_status_updated_idx ON notebooks (status, updated_at DESC)`);
    await q.query(`CREATE INDEX notebooks_owner_idx ON notebooks (owner_id)`);
    await q.query(`CREATE INDEX notebooks_title_lower_idx ON notebooks (lower(title) text_pattern_ops)`);
    await q.query(`
      CREATE FUNCTION cribra_notebooks_notify() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        PERFORM pg_notify('cribra_notebooks', json_build_object('notebookId', NEW.id, 'revision', NEW.revision)::text);
        RETURN NEW;
      END $$`);
    await q.query(`
      CREATE TRIGGER notebooks_notify AFTER UPDATE OF revision ON notebooks
      FOR EACH ROW WHEN (OLD.revision IS DISTINCT FROM NEW.revision) EXECUTE FUNCTION cribra_notebooks_notify()`);

    await q.query(`
      CREATE TABLE notebook_members (
        notebook_id uuid NOT NULL REFERENCES notebooks (id) ON DELETE CASCADE,
        user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
        role varchar(16) NOT NULL CHECK (role IN ('owner', 'editor', 'reviewer', 'viewer')),
        added_by uuid REFERENCES users (id) ON DELETE SET NULL,
        added_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (notebook_id, user_id)
      )`);
    await q.query(`CREATE INDEX notebook_members_user_idx ON notebook_members (user_id, role)`);
    await q.query(`CREATE UNIQUE INDEX notebook_members_one_owner ON notebook_members (notebook_id) WHERE role = 'owner'`);

    await q.query(`
      CREATE TABLE cells (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        notebook_id uuid NOT NULL REFERENCES notebooks (id) ON DELETE CASCADE,
        kind varchar(8) NOT NULL CHECK (kind IN ('query', 'claim', 'note')),
        source text NOT NULL DEFAULT '',
        position int NOT NULL CHECK (position >= 0),
        revision int NOT NULL DEFAULT 1 CHECK (revision >= 1),
        author_id uuid NOT NULL REFERENCES users (id),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        -- deferred so that a reorder can permute positions inside one transaction
        CONSTRAINT cells_notebook_position_key UNIQUE (notebook_id, position) DEFERRABLE INITIALLY DEFERRED
      )`);

    await q.query(`
      CREATE TABLE runs (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        notebook_id uuid NOT NULL REFERENCES notebooks (id) ON DELETE CASCADE,
        cell_id uuid NOT NULL REFERENCES cells (id) ON DELETE CASCADE,
        cell_revision int NOT NULL,
        cell_kind varchar(8) NOT NULL,
        source text NOT NULL,
        purpose varchar(16) NOT NULL DEFAULT 'run' CHECK (purpose IN ('run', 'reverify')),
        status varchar(16) NOT NULL DEFAULT 'queued'
          CHECK (status IN ('queued', 'running', 'succeeded', 'failed', 'cancelled')),
        progress real NOT NULL DEFAULT 0 CHECK (progress >= 0 AND progress <= 1),
        progress_note varchar(200),
        outputs jsonb,
        output_digest varchar(128),
        engine_version varchar(32),
        language_version varchar(32),
        runner_id varchar(120),
        attempts int NOT NULL DEFAULT 0,
        job_id uuid,
        requested_by uuid NOT NULL REFERENCES users (id),
        queued_at timestamptz NOT NULL DEFAULT now(),
        started_at timestamptz,
        finished_at timestamptz,
        duration_ms int,
        error jsonb
      )`);
    await q.query(`CREATE INDEX runs_cell_idx ON runs (cell_id, queued_at DESC)`);
    await q.query(`CREATE INDEX runs_notebook_idx ON runs (notebook_id, queued_at DESC)`);
    await q.query(`CREATE INDEX runs_active_idx ON runs (status) WHERE status IN ('queued', 'running')`);
    await q.query(`
      CREATE FUNCTION cribra_runs_notify() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        PERFORM pg_notify('cribra_runs', json_build_object(
          'id', NEW.id, 'notebookId', NEW.notebook_id, 'cellId', NEW.cell_id, 'status', NEW.status,
          'progress', NEW.progress, 'progressNote', NEW.progress_note, 'outputDigest', NEW.output_digest
        )::text);
        RETURN NEW;
      END $$`);
    await q.query(`
      CREATE TRIGGER runs_notify AFTER INSERT OR UPDATE ON runs
      FOR EACH ROW EXECUTE FUNCTION cribra_runs_notify()`);

    await q.query(`
      CREATE TABLE computations (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        kind varchar(16) NOT NULL CHECK (kind IN ('level', 'ledger')),
        params jsonb NOT NULL,
        status varchar(16) NOT NULL DEFAULT 'queued' CHECK (status IN ('queued', 'running', 'succeeded', 'failed')),
        chunks_total int NOT NULL DEFAULT 0,
        chunks_done int NOT NULL DEFAULT 0,
        requested_by uuid REFERENCES users (id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        started_at timestamptz,
        finished_at timestamptz,
        error text
      )`);
    await q.query(`CREATE INDEX computations_kind_status_idx ON computations (kind, status, created_at DESC)`);

    await q.query(`
      CREATE TABLE wheel_levels (
        prime int PRIMARY KEY CHECK (prime >= 2),
        modulus text NOT NULL,
        phi text NOT NULL,
        largest_gap int,
        histogram jsonb,
        pattern_tallies jsonb,
        digest varchar(128),
        status varchar(16) NOT NULL DEFAULT 'pending' CHECK (status IN ('pending', 'computing', 'stored', 'failed')),
        computation_id uuid REFERENCES computations (id) ON DELETE SET NULL,
        computed_by varchar(120),
        computed_at timestamptz,
        engine_version varchar(32)
      )`);
    await q.query(`
      CREATE TABLE level_chunks (
        computation_id uuid NOT NULL REFERENCES computations (id) ON DELETE CASCADE,
        chunk_index int NOT NULL,
        summary jsonb NOT NULL,
        runner_id varchar(120) NOT NULL,
        computed_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (computation_id, chunk_index)
      )`);

    await q.query(`
      CREATE TABLE ledger_blocks (
        block_index int PRIMARY KEY CHECK (block_index >= 0),
        start_n bigint NOT NULL,
        end_n bigint NOT NULL,
        prime_count bigint NOT NULL,
        first_prime bigint,
        last_prime bigint,
        gap_histogram jsonb NOT NULL,
        constellations jsonb NOT NULL,
        record_gaps jsonb NOT NULL,
        summary jsonb NOT NULL,
        digest varchar(128) NOT NULL,
        computed_by varchar(120),
        computed_at timestamptz NOT NULL DEFAULT now(),
        engine_version varchar(32) NOT NULL,
        CHECK (end_n > start_n)
      )`);

    await q.query(`
      CREATE TABLE uploads (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        notebook_id uuid NOT NULL REFERENCES notebooks (id) ON DELETE CASCADE,
        owner_id uuid NOT NULL REFERENCES users (id),
        name varchar(64) NOT NULL,
        original_name varchar(255) NOT NULL,
        kind varchar(8) NOT NULL CHECK (kind IN ('tuples', 'table')),
        media_type varchar(100) NOT NULL,
        size_bytes int NOT NULL,
        sha256 char(64) NOT NULL,
        row_count int NOT NULL,
        columns jsonb,
        content jsonb NOT NULL,
        raw bytea NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT uploads_notebook_name_key UNIQUE (notebook_id, name)
      )`);

    await q.query(`
      CREATE TABLE audit_events (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        at timestamptz NOT NULL DEFAULT now(),
        actor_id uuid REFERENCES users (id) ON DELETE SET NULL,
        notebook_id uuid,
        action varchar(64) NOT NULL,
        details jsonb NOT NULL DEFAULT '{}'
      )`);
    await q.query(`CREATE INDEX audit_events_notebook_idx ON audit_events (notebook_id, at DESC)`);
    await q.query(`CREATE INDEX audit_events_actor_idx ON audit_events (actor_id, at DESC)`);

    await q.query(`
      CREATE TABLE runners (
        id varchar(120) PRIMARY KEY,
        host varchar(200) NOT NULL,
        pid int NOT NULL,
        started_at timestamptz NOT NULL DEFAULT now(),
        last_seen_at timestamptz NOT NULL DEFAULT now(),
        current_job varchar(200),
        jobs_done int NOT NULL DEFAULT 0,
        stopped_at timestamptz
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE runners`);
    await q.query(`DROP TABLE audit_events`);
    await q.query(`DROP TABLE uploads`);
    await q.query(`DROP TABLE ledger_blocks`);
    await q.query(`DROP TABLE level_chunks`);
    await q.query(`DROP TABLE wheel_levels`);
    await q.query(`DROP TABLE computations`);
    await q.query(`DROP TRIGGER runs_notify ON runs`);
    await q.query(`DROP FUNCTION cribra_runs_notify()`);
    await q.query(`DROP TABLE runs`);
    await q.query(`DROP TABLE cells`);
    await q.query(`DROP TABLE notebook_members`);
    await q.query(`DROP TABLE notebooks`);
    await q.query(`DROP FUNCTION cribra_notebooks_notify()`);
    await q.query(`DROP FUNCTION cribra_tags_text(text[])`);
  }
}

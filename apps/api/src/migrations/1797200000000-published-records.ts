import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Published records: a locked notebook's lock record at a permanent public address `/records/<id>`
 * (id = the first 20 hex digits of the record's SHA-256). A trigger keeps a published record as it
 * was: no DELETE, and the only UPDATE allowed is the one withdrawal (withdrawn_at/by/reason set
 * once, from null; everything else unchanged). SQLSTATE 'CRPUB' otherwise. The maintenance escape
 * hatch of the lock trigger (`SET LOCAL cribra.allow_locked_changes = 'on'`) applies here too.
 */
export class PublishedRecords1797200000000 implements MigrationInterface {
  name = 'PublishedRecords1797200000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE published_records (
        id text PRIMARY KEY CHECK (id ~ '^[0-9a-f]{20}$'),
        notebook_id uuid NOT NULL UNIQUE REFERENCES notebooks (id) ON DELETE CASCADE,
        record_sha256 char(64) NOT NULL,
        record jsonb NOT NULL,
        content jsonb NOT NULL,
        published_by uuid NOT NULL REFERENCES users (id),
        published_at timestamptz NOT NULL DEFAULT now(),
        withdrawn_at timestamptz,
        withdrawn_by uuid REFERENCES users (id),
        withdraw_reason text,
        CHECK ((withdrawn_at IS NULL) = (withdrawn_by IS NULL) AND (withdrawn_at IS NULL) = (withdraw_reason IS NULL))
      )`);
    await q.query(`
      CREATE FUNCTION cribra_guard_published() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF current_setting('cribra.allow_locked_changes', true) = 'on' THEN
          IF TG_OP = 'DELETE' THEN RETURN OLD; END IF;
          RETURN NEW;
        END IF;
        IF TG_OP = 'DELETE' THEN
          RAISE EXCEPTION 'published record % never changes: DELETE refused', OLD.id USING ERRCODE = 'CRPUB';
        END IF;
        IF OLD.withdrawn_at IS NOT NULL OR NEW.withdrawn_at IS NULL
           OR (NEW.id, NEW.notebook_id, NEW.record_sha256, NEW.published_by, NEW.published_at)
              IS DISTINCT FROM (OLD.id, OLD.notebook_id, OLD.record_sha256, OLD.published_by, OLD.published_at)
           OR NEW.record IS DISTINCT FROM OLD.record OR NEW.content IS DISTINCT FROM OLD.content THEN
          RAISE EXCEPTION 'published record % never changes: only one withdrawal is allowed', OLD.id USING ERRCODE = 'CRPUB';
        END IF;
        RETURN NEW;
      END $$`);
    await q.query(`
      CREATE TRIGGER published_records_guard BEFORE UPDATE OR DELETE ON published_records
      FOR EACH ROW EXECUTE FUNCTION cribra_guard_published()`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TRIGGER published_records_guard ON published_records`);
    await q.query(`DROP FUNCTION cribra_guard_published()`);
    await q.query(`DROP TABLE published_records`);
  }
}

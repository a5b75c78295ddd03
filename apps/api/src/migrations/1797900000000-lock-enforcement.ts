import { MigrationInterface, QueryRunner } from 'typeorm';

/** Tables whose rows of a locked notebook are frozen (each has notebook_id). */
const GUARDED = ['cells', 'runs', 'reviews', 'notebook_locks', 'uploads'];
/** TRUNCATE is refused on these (it fires no row trigger, so it would skip every check). */
const NO_TRUNCATE = ['notebooks', ...GUARDED];

/**
 * The database enforces the lock for every writer but the schema owner:
 * - the row trigger checks the notebook of the new row as well as of the old one (moving a cell
 *   into a locked notebook is refused), and reads it FOR KEY SHARE, which waits while a lock is
 *   being taken (LocksService holds the notebook row FOR UPDATE): a run accepted at the moment of
 *   the lock either commits first (the lock then sees it and refuses) or sees the lock and is
 *   refused — never both accepted;
 * - `uploads` is guarded too; TRUNCATE of any guarded table is refused;
 * - a run's purpose never changes (a re-verification run cannot become an ordinary run);
 * - a run that never finished may still be closed (failed or cancelled, outputs untouched) in a
 *   locked notebook, so nothing stays queued forever;
 * - the escape hatch `SET LOCAL cribra.allow_locked_changes = 'on'` is honoured only for a member
 *   of the table's owner role (migrations, maintenance), not for the app's role (`cribra_app`,
 *   created by apps/api/src/database/app-role.ts), which owns nothing.
 */
export class LockEnforcement1797900000000 implements MigrationInterface {
  name = 'LockEnforcement1797900000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE FUNCTION cribra_guard_may_bypass(rel oid) RETURNS boolean LANGUAGE sql STABLE AS $$
        SELECT coalesce(current_setting('cribra.allow_locked_changes', true), '') = 'on'
           AND pg_has_role(current_user, (SELECT relowner FROM pg_class WHERE oid = rel), 'MEMBER')
      $$`);
    await q.query(`
      CREATE OR REPLACE FUNCTION cribra_guard_locked() RETURNS trigger LANGUAGE plpgsql AS $$
      DECLARE
        ids uuid[];
        nb uuid;
        nb_status varchar;
        locked timestamptz;
      BEGIN
        IF cribra_guard_may_bypass(TG_RELID) THEN
          IF TG_OP = 'DELETE' THEN RETURN OLD; END IF;
          RETURN NEW;
        END IF;
        IF TG_OP = 'INSERT' THEN ids := ARRAY[NEW.notebook_id];
        ELSIF TG_OP = 'UPDATE' THEN ids := ARRAY[OLD.notebook_id, NEW.notebook_id];
        ELSE ids := ARRAY[OLD.notebook_id];
        END IF;
        FOREACH nb IN ARRAY ids LOOP
          SELECT status INTO nb_status FROM notebooks WHERE id = nb FOR KEY SHARE;
          IF nb_status = 'locked' THEN
            -- (nested IFs: a record field is only read when the table has it)
            IF TG_TABLE_NAME = 'runs' THEN
              -- Lock checks insert re-verification runs after the lock; runners must update them.
              SELECT locked_at INTO locked FROM notebook_locks WHERE notebook_id = nb;
              IF TG_OP = 'INSERT' THEN
                IF NEW.purpose = 'reverify' THEN CONTINUE; END IF;
              ELSIF TG_OP = 'UPDATE' THEN
                IF OLD.notebook_id = NEW.notebook_id AND OLD.purpose = 'reverify' AND OLD.queued_at > locked THEN CONTINUE; END IF;
                -- A run that never finished may be closed, changing nothing the record holds.
                IF OLD.notebook_id = NEW.notebook_id AND OLD.status IN ('queued', 'running')
                   AND NEW.status IN ('failed', 'cancelled') AND NEW.cell_id = OLD.cell_id AND NEW.source = OLD.source
                   AND NEW.outputs IS NOT DISTINCT FROM OLD.outputs
                   AND NEW.output_digest IS NOT DISTINCT FROM OLD.output_digest THEN CONTINUE; END IF;
              ELSIF OLD.purpose = 'reverify' AND OLD.queued_at > locked THEN CONTINUE;
              END IF;
            END IF;
            RAISE EXCEPTION 'notebook % is locked: % on % refused', nb, TG_OP, TG_TABLE_NAME
              USING ERRCODE = 'CRLCK', HINT = 'Duplicate the notebook to make changes.';
          END IF;
        END LOOP;
        IF TG_OP = 'DELETE' THEN RETURN OLD; END IF;
        RETURN NEW;
      END $$`);
    await q.query(`
      CREATE OR REPLACE FUNCTION cribra_guard_locked_notebook() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF OLD.status = 'locked' AND NOT cribra_guard_may_bypass(TG_RELID) THEN
          RAISE EXCEPTION 'notebook % is locked: % refused', OLD.id, TG_OP
            USING ERRCODE = 'CRLCK', HINT = 'Duplicate the notebook to make changes.';
        END IF;
        IF TG_OP = 'DELETE' THEN RETURN OLD; END IF;
        RETURN NEW;
      END $$`);
    await q.query(`
      CREATE FUNCTION cribra_guard_no_truncate() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF NOT cribra_guard_may_bypass(TG_RELID) THEN
          RAISE EXCEPTION 'TRUNCATE on % refused: it would bypass the lock of locked notebooks', TG_TABLE_NAME
            USING ERRCODE = 'CRLCK', HINT = 'Delete rows instead.';
        END IF;
        RETURN NULL;
      END $$`);
    await q.query(`
      CREATE FUNCTION cribra_guard_run_purpose() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF NEW.purpose IS DISTINCT FROM OLD.purpose AND NOT cribra_guard_may_bypass(TG_RELID) THEN
          RAISE EXCEPTION 'the purpose of run % cannot change (% to %)', OLD.id, OLD.purpose, NEW.purpose
            USING ERRCODE = 'CRLCK';
        END IF;
        RETURN NEW;
      END $$`);
    await q.query(`
      CREATE TRIGGER runs_purpose_fixed BEFORE UPDATE OF purpose ON runs
      FOR EACH ROW EXECUTE FUNCTION cribra_guard_run_purpose()`);
    await q.query(`
      CREATE TRIGGER uploads_guard_locked BEFORE INSERT OR UPDATE OR DELETE ON uploads
      FOR EACH ROW EXECUTE FUNCTION cribra_guard_locked()`);
    for (const table of NO_TRUNCATE) {
      await q.query(`
        CREATE TRIGGER ${table}_no_truncate BEFORE TRUNCATE ON ${table}
        FOR EACH STATEMENT EXECUTE FUNCTION cribra_guard_no_truncate()`);
    }
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of [...NO_TRUNCATE].reverse()) await q.query(`DROP TRIGGER ${table}_no_truncate ON ${table}`);
    await q.query(`DROP TRIGGER uploads_guard_locked ON uploads`);
    await q.query(`DROP TRIGGER runs_purpose_fixed ON runs`);
    await q.query(`DROP FUNCTION cribra_guard_run_purpose()`);
    await q.query(`DROP FUNCTION cribra_guard_no_truncate()`);
    // The functions as migration 1796300000000 created them.
    await q.query(`
      CREATE OR REPLACE FUNCTION cribra_guard_locked() RETURNS trigger LANGUAGE plpgsql AS $$
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
    await q.query(`
      CREATE OR REPLACE FUNCTION cribra_guard_locked_notebook() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF OLD.status = 'locked' AND coalesce(current_setting('cribra.allow_locked_changes', true), '') <> 'on' THEN
          RAISE EXCEPTION 'notebook % is locked: % refused', OLD.id, TG_OP
            USING ERRCODE = 'CRLCK', HINT = 'Duplicate the notebook to make changes.';
        END IF;
        IF TG_OP = 'DELETE' THEN RETURN OLD; END IF;
        RETURN NEW;
      END $$`);
    await q.query(`DROP FUNCTION cribra_guard_may_bypass(oid)`);
  }
}

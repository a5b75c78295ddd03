import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Presence: one row per open notebook tab (who, which cell's editor has the focus, last heartbeat).
 * Rows older than the quiet limit count as gone. Arrivals, departures and focus changes are
 * announced as `presence` on `cribra_notebook_state` (heartbeats alone are not).
 */
export class NotebookPresence1797300200000 implements MigrationInterface {
  name = 'NotebookPresence1797300200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE notebook_presence (
        notebook_id uuid NOT NULL REFERENCES notebooks (id) ON DELETE CASCADE,
        user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
        tab_id varchar(64) NOT NULL,
        cell_id uuid,
        seen_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (notebook_id, user_id, tab_id)
      )`);
    await q.query(`
      CREATE TRIGGER notebook_presence_state_notify AFTER INSERT OR DELETE ON notebook_presence
      FOR EACH ROW EXECUTE FUNCTION cribra_notebook_state_notify('presence')`);
    await q.query(`
      CREATE TRIGGER notebook_presence_focus_notify AFTER UPDATE ON notebook_presence
      FOR EACH ROW WHEN (OLD.cell_id IS DISTINCT FROM NEW.cell_id) EXECUTE FUNCTION cribra_notebook_state_notify('presence')`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE notebook_presence`);
  }
}

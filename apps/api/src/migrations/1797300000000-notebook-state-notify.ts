import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Live notebook state: triggers announce, on channel `cribra_notebook_state`, every change that
 * the review panel and the header show — status (review asked, changes asked, lock), review
 * requests, re-verifications, reviews (sign-offs and their voiding), lock records, members and
 * invitations. The payload is `{notebookId, topic}`; pages refetch what the topic concerns.
 * Triggers rather than calls in each service so that any writer (another API process, a runner
 * finishing a re-verify, a maintenance script) is heard too.
 */
export class NotebookStateNotify1797300000000 implements MigrationInterface {
  name = 'NotebookStateNotify1797300000000';

  private readonly triggers: Array<[table: string, events: string, topic: string, when?: string]> = [
    ['notebooks', 'UPDATE OF status', 'status', 'OLD.status IS DISTINCT FROM NEW.status'],
    ['review_requests', 'INSERT', 'review'],
    ['verifications', 'INSERT OR UPDATE', 'verification'],
    ['reviews', 'INSERT OR UPDATE', 'review'],
    ['notebook_locks', 'INSERT OR DELETE', 'lock'],
    ['notebook_members', 'INSERT OR UPDATE OR DELETE', 'members'],
    ['invitations', 'INSERT OR UPDATE OR DELETE', 'members'],
  ];

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE FUNCTION cribra_notebook_state_notify() RETURNS trigger LANGUAGE plpgsql AS $$
      DECLARE
        r jsonb := to_jsonb(CASE WHEN TG_OP = 'DELETE' THEN OLD ELSE NEW END);
      BEGIN
        PERFORM pg_notify('cribra_notebook_state', json_build_object(
          'notebookId', coalesce(r->>'notebook_id', r->>'id'), 'topic', TG_ARGV[0])::text);
        RETURN NULL;
      END $$`);
    for (const [table, events, topic, when] of this.triggers) {
      await q.query(`
        CREATE TRIGGER ${table}_state_notify AFTER ${events} ON ${table}
        FOR EACH ROW ${when ? `WHEN (${when})` : ''} EXECUTE FUNCTION cribra_notebook_state_notify('${topic}')`);
    }
  }

  async down(q: QueryRunner): Promise<void> {
    for (const [table] of [...this.triggers].reverse()) await q.query(`DROP TRIGGER ${table}_state_notify ON ${table}`);
    await q.query(`DROP FUNCTION cribra_notebook_state_notify()`);
  }
}

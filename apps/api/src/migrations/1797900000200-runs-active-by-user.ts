import { MigrationInterface, QueryRunner } from 'typeorm';

/** Counting a person's queued and running runs (the fairness priority of their next run) by index. */
export class RunsActiveByUser1797900000200 implements MigrationInterface {
  name = 'RunsActiveByUser1797900000200';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE INDEX runs_active_by_user_idx ON runs (requested_by) WHERE status IN ('queued', 'running')`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX runs_active_by_user_idx`);
  }
}

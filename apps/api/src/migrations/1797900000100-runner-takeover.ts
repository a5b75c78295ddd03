import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Heartbeat-based takeover of a dead runner's work: each runner's heartbeat lists the jobs it is
 * executing (`active_jobs`, [{queue, id}]); a live runner that finds a runner silent for longer
 * than CRIBRA_RUNNER_DEAD_AFTER_SECONDS marks it taken over (once: a conditional UPDATE) and hands
 * its runs and jobs back to the queue, instead of waiting for the jobs' expiry.
 */
export class RunnerTakeover1797900000100 implements MigrationInterface {
  name = 'RunnerTakeover1797900000100';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE runners ADD COLUMN active_jobs jsonb NOT NULL DEFAULT '[]'`);
    await q.query(`ALTER TABLE runners ADD COLUMN taken_over_at timestamptz`);
    await q.query(`ALTER TABLE runners ADD COLUMN taken_over_by varchar(120)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE runners DROP COLUMN taken_over_by`);
    await q.query(`ALTER TABLE runners DROP COLUMN taken_over_at`);
    await q.query(`ALTER TABLE runners DROP COLUMN active_jobs`);
  }
}

import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Cancelling computations: a computation (and the wheel level it was computing) may end as
 * 'cancelled'. Runners check the status before each chunk and skip the rest; what is stored stays.
 */
export class ComputationCancel1797300100000 implements MigrationInterface {
  name = 'ComputationCancel1797300100000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE computations DROP CONSTRAINT computations_status_check`);
    await q.query(`ALTER TABLE computations ADD CONSTRAINT computations_status_check
      CHECK (status IN ('queued', 'running', 'succeeded', 'failed', 'cancelled'))`);
    await q.query(`ALTER TABLE wheel_levels DROP CONSTRAINT wheel_levels_status_check`);
    await q.query(`ALTER TABLE wheel_levels ADD CONSTRAINT wheel_levels_status_check
      CHECK (status IN ('pending', 'computing', 'stored', 'failed', 'cancelled'))`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`UPDATE computations SET status = 'failed', error = coalesce(error, 'cancelled') WHERE status = 'cancelled'`);
    await q.query(`UPDATE wheel_levels SET status = 'failed' WHERE status = 'cancelled'`);
    await q.query(`ALTER TABLE computations DROP CONSTRAINT computations_status_check`);
    await q.query(`ALTER TABLE computations ADD CONSTRAINT computations_status_check
      CHECK (status IN ('queued', 'running', 'succeeded', 'failed'))`);
    await q.query(`ALTER TABLE wheel_levels DROP CONSTRAINT wheel_levels_status_check`);
    await q.query(`ALTER TABLE wheel_levels ADD CONSTRAINT wheel_levels_status_check
      CHECK (status IN ('pending', 'computing', 'stored', 'failed'))`);
  }
}

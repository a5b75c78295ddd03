import type { Pool } from 'pg';
import type { RunnerConfig } from './runner-config';

/** A job being executed, as listed in the heartbeat (so that a takeover knows what to hand back). */
export interface ActiveJob {
  queue: string;
  id: string;
}

/**
 * The runner's row in `runners`: registered at start, `last_seen_at` and the jobs in hand
 * (`active_jobs`) refreshed every few seconds, `stopped_at` set on a clean stop. A row whose
 * heartbeat is old belongs to a dead runner; a live runner takes its work over (takeover.ts).
 */
export class Heartbeat {
  private timer: NodeJS.Timeout | null = null;
  current: string | null = null;

  constructor(
    private readonly db: Pool,
    private readonly cfg: RunnerConfig,
    private readonly activeJobs: () => ActiveJob[] = () => [],
  ) {}

  async start(): Promise<void> {
    await this.db.query(
      `INSERT INTO runners (id, host, pid) VALUES ($1, $2, $3)
       ON CONFLICT (id) DO UPDATE SET last_seen_at = now(), stopped_at = NULL, taken_over_at = NULL, taken_over_by = NULL, active_jobs = '[]'`,
      [this.cfg.runnerId, this.cfg.host.slice(0, 200), process.pid],
    );
    this.timer = setInterval(() => void this.beat().catch(() => undefined), this.cfg.heartbeatMs);
    this.timer.unref();
  }

  async beat(): Promise<void> {
    // A runner presumed dead that was only slow shows up again (its old jobs were handed back).
    await this.db.query(
      `UPDATE runners SET last_seen_at = now(), current_job = $2, active_jobs = $3, taken_over_at = NULL, taken_over_by = NULL WHERE id = $1`,
      [this.cfg.runnerId, this.current, JSON.stringify(this.activeJobs())],
    );
  }

  async jobDone(): Promise<void> {
    await this.db.query(`UPDATE runners SET jobs_done = jobs_done + 1 WHERE id = $1`, [this.cfg.runnerId]);
  }

  async stop(): Promise<void> {
    if (this.timer) clearInterval(this.timer);
    await this.db.query(`UPDATE runners SET stopped_at = now(), current_job = NULL, active_jobs = '[]' WHERE id = $1`, [this.cfg.runnerId]).catch(() => undefined);
  }
}

import type { Pool } from 'pg';
import type { RunnerConfig } from './runner-config';

/**
 * The runner's row in `runners`: registered at start, `last_seen_at` refreshed every few seconds,
 * `stopped_at` set on a clean stop. A row whose heartbeat is old belongs to a dead runner; its jobs
 * come back through pg-boss expiry, so nothing here has to clean up after it.
 */
export class Heartbeat {
  private timer: NodeJS.Timeout | null = null;
  current: string | null = null;

  constructor(
    private readonly db: Pool,
    private readonly cfg: RunnerConfig,
  ) {}

  async start(): Promise<void> {
    await this.db.query(
      `INSERT INTO runners (id, host, pid) VALUES ($1, $2, $3)
       ON CONFLICT (id) DO UPDATE SET last_seen_at = now(), stopped_at = NULL`,
      [this.cfg.runnerId, this.cfg.host.slice(0, 200), process.pid],
    );
    this.timer = setInterval(() => void this.beat().catch(() => undefined), this.cfg.heartbeatMs);
    this.timer.unref();
  }

  async beat(): Promise<void> {
    await this.db.query(`UPDATE runners SET last_seen_at = now(), current_job = $2 WHERE id = $1`, [this.cfg.runnerId, this.current]);
  }

  async jobDone(): Promise<void> {
    await this.db.query(`UPDATE runners SET jobs_done = jobs_done + 1 WHERE id = $1`, [this.cfg.runnerId]);
  }

  async stop(): Promise<void> {
    if (this.timer) clearInterval(this.timer);
    await this.db.query(`UPDATE runners SET stopped_at = now(), current_job = NULL WHERE id = $1`, [this.cfg.runnerId]).catch(() => undefined);
  }
}

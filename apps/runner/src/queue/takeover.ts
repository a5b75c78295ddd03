import type PgBoss from 'pg-boss';
import type { Pool } from 'pg';
import { QUEUES, type QueueName } from '@cribra/contracts';
import type { ActiveJob } from '../heartbeat';

/**
 * Takes over the work of runners whose heartbeat stopped: every live runner looks every few
 * seconds; the conditional UPDATE lets exactly one of them claim a given dead runner (so its work
 * is handed back once). Its running runs return to `queued` (the run keeps its attempts count, the
 * next claim adds one), and its jobs — those listed in its last heartbeat plus the jobs of those
 * runs — are failed in pg-boss, which retries them on whichever runner asks next (after the
 * retry delay of 1 s) instead of after the job expiry (15 minutes by default).
 * Returns the ids of the runners taken over.
 */
export async function takeOverDeadRunners(
  db: Pool,
  boss: PgBoss,
  me: string,
  deadAfterSeconds: number,
  log: (m: string) => void,
): Promise<string[]> {
  const { rows: dead } = await db.query<{ id: string; active_jobs: ActiveJob[]; last_seen_at: Date }>(
    `UPDATE runners SET taken_over_at = now(), taken_over_by = $2, current_job = NULL
      WHERE stopped_at IS NULL AND taken_over_at IS NULL AND id <> $2
        AND last_seen_at < now() - make_interval(secs => $1)
      RETURNING id, active_jobs, last_seen_at`,
    [deadAfterSeconds, me],
  );
  const taken: string[] = [];
  for (const runner of dead) {
    const released = await db.query<{ id: string; job_id: string | null }>(
      `UPDATE runs SET status = 'queued', runner_id = NULL, progress = 0, progress_note = NULL
        WHERE runner_id = $1 AND status = 'running' RETURNING id, job_id`,
      [runner.id],
    );
    const jobs = new Map<string, QueueName>();
    for (const j of runner.active_jobs ?? []) jobs.set(j.id, j.queue as QueueName);
    for (const r of released.rows) if (r.job_id) jobs.set(r.job_id, QUEUES.runCell);
    for (const [id, queue] of jobs) {
      await boss.fail(queue, id, { message: `runner ${runner.id} stopped heart-beating; taken over by ${me}` }).catch(() => undefined);
    }
    // A run whose job had no retry left is closed as failed (nobody would execute it otherwise).
    for (const r of released.rows) {
      if (!r.job_id) continue;
      const { rows } = await db.query<{ state: string }>(`SELECT state FROM pgboss.job WHERE id = $1`, [r.job_id]).catch(() => ({ rows: [] as Array<{ state: string }> }));
      if (rows[0]?.state === 'failed') {
        await db.query(
          `UPDATE runs SET status = 'failed', finished_at = now(), error = $2 WHERE id = $1 AND status = 'queued'`,
          [r.id, JSON.stringify({ kind: 'internal', message: `runner ${runner.id} stopped heart-beating and the run's job has no retry left` })],
        );
      }
    }
    const silent = ((Date.now() - new Date(runner.last_seen_at).getTime()) / 1000).toFixed(0);
    log(`took over runner ${runner.id} (no heartbeat for ${silent} s): ${released.rowCount} run(s) and ${jobs.size} job(s) back to the queue`);
    taken.push(runner.id);
  }
  return taken;
}

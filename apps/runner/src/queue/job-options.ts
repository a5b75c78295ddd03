import { QUEUE_RETRY_LIMIT, QUEUES } from '@cribra/contracts';
import type PgBoss from 'pg-boss';
import type { RunnerConfig } from '../runner-config';

/** Options of the jobs a runner sends (chunks, combines): retried by any runner after expiry. */
export function jobOptions(cfg: RunnerConfig): { retryLimit: number; retryDelay: number; expireInSeconds: number } {
  return { retryLimit: QUEUE_RETRY_LIMIT, retryDelay: 1, expireInSeconds: cfg.jobExpireSeconds };
}

/** Creates our queues if missing (the API does the same; whoever starts first wins). */
export async function ensureQueues(boss: PgBoss, cfg: RunnerConfig): Promise<void> {
  const existing = new Set((await boss.getQueues()).map((q) => q.name));
  for (const name of Object.values(QUEUES)) {
    if (existing.has(name)) continue;
    try {
      await boss.createQueue(name, { name, ...jobOptions(cfg) });
    } catch (err) {
      if (!(await boss.getQueue(name))) throw err;
    }
  }
}

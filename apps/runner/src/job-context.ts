import type PgBoss from 'pg-boss';
import type { Pool } from 'pg';
import type { RunnerConfig } from './runner-config';
import type { SiftExecutor } from './sift/sift-executor';

/** What every job handler gets: the database, the queue, this runner's settings and the Sift pool. */
export interface JobContext {
  db: Pool;
  boss: PgBoss;
  cfg: RunnerConfig;
  executor: SiftExecutor;
  log: (message: string) => void;
}

/** A job handler; throwing fails the job, which pg-boss then retries (on any runner). */
export type JobHandler<T> = (ctx: JobContext, job: PgBoss.JobWithMetadata<T>) => Promise<void>;

export const sleep = (ms: number): Promise<void> => new Promise((r) => setTimeout(r, ms));

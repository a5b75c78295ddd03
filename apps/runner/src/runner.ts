import PgBoss from 'pg-boss';
import { Pool } from 'pg';
import { QUEUES, type QueueName } from '@cribra/contracts';
import { Heartbeat } from './heartbeat';
import { sleep, type JobContext, type JobHandler } from './job-context';
import { combine } from './jobs/combine.job';
import { ledgerBlock } from './jobs/ledger-block.job';
import { levelChunk } from './jobs/level-chunk.job';
import { plan } from './jobs/plan.job';
import { runCell } from './jobs/run-cell.job';
import { ensureQueues } from './queue/job-options';
import { RunWakeup } from './queue/run-wakeup';
import { takeOverDeadRunners } from './queue/takeover';
import type { RunnerConfig } from './runner-config';
import type { SiftExecutor } from './sift/sift-executor';

/** Longest time between two looks for dead runners (takeover within dead-after + this). */
const TAKEOVER_CHECK_MS = 5000;

/** SQLSTATE raised by the database trigger that freezes locked notebooks (review feature). */
const LOCKED_NOTEBOOK = 'CRLCK';

/**
 * After a run was queued: fetches retried this many times before the idle poll, 5, 10, 20, 40 ms
 * apart (every idle runner hears the notification; only one gets the job, so the others should not
 * keep asking).
 */
const EAGER_RETRIES = 4;
const EAGER_RETRY_MS = 5;

/** Queues in the order a free slot looks at them: people waiting on a cell come first. */
const HANDLERS: Array<[QueueName, JobHandler<never>]> = [
  [QUEUES.runCell, runCell as JobHandler<never>],
  [QUEUES.combine, combine as JobHandler<never>],
  [QUEUES.plan, plan as JobHandler<never>],
  [QUEUES.levelChunk, levelChunk as JobHandler<never>],
  [QUEUES.ledgerBlock, ledgerBlock as JobHandler<never>],
];
/** What a runner asks for while waiting for the job of a run it was told about. */
const RUN_CELL_ONLY = HANDLERS.slice(0, 1);

/**
 * A runner process: takes jobs from pg-boss (any number of runners, on any machine, share the
 * queues), executes up to `slots` at once, completes or fails them. A job whose runner dies is
 * expired by pg-boss maintenance (run by every runner) and retried elsewhere; handlers are
 * idempotent, so retried work is stored once.
 */
export class Runner {
  readonly db: Pool;
  readonly boss: PgBoss;
  private readonly heartbeat: Heartbeat;
  private readonly ctx: JobContext;
  private active = 0;
  /** Jobs being executed, so that a stop can hand unfinished ones back at once. */
  private readonly inFlight = new Map<string, QueueName>();
  private stopping = false;
  private wake: (() => void) | null = null;
  private loop: Promise<void> | null = null;
  private readonly wakeup: RunWakeup;
  private takeoverTimer: NodeJS.Timeout | null = null;
  /**
   * Short retries left after a run was queued: its job is sent just after the run row commits (the
   * notification's moment), so the first fetch may come a few milliseconds too early.
   */
  private eager = 0;

  constructor(
    private readonly cfg: RunnerConfig,
    executor: SiftExecutor,
  ) {
    this.db = new Pool({ connectionString: cfg.databaseUrl, max: cfg.slots + 4 });
    this.db.on('error', (err) => this.log(`database: ${err.message}`));
    this.boss = new PgBoss({
      connectionString: cfg.databaseUrl,
      schema: 'pgboss',
      max: 4,
      supervise: true,
      schedule: false,
      maintenanceIntervalSeconds: cfg.maintenanceSeconds,
    });
    this.boss.on('error', (err) => this.log(`queue: ${err.message}`));
    this.heartbeat = new Heartbeat(this.db, cfg, () => [...this.inFlight].map(([id, queue]) => ({ queue, id })));
    this.wakeup = new RunWakeup(
      cfg.databaseUrl,
      () => {
        this.eager = EAGER_RETRIES;
        this.wake?.();
      },
      (m) => this.log(m),
    );
    this.ctx = { db: this.db, boss: this.boss, cfg, executor, log: (m) => this.log(m) };
  }

  log(message: string): void {
    console.log(`[runner ${this.cfg.runnerId}] ${message}`);
  }

  async start(): Promise<void> {
    await this.boss.start();
    await ensureQueues(this.boss, this.cfg);
    await this.heartbeat.start();
    await this.wakeup.start();
    this.loop = this.run();
    this.takeoverTimer = setInterval(() => {
      void takeOverDeadRunners(this.db, this.boss, this.cfg.runnerId, this.cfg.deadAfterSeconds, (m) => this.log(m))
        .then((taken) => {
          if (taken.length) this.wake?.();
        })
        .catch((err: Error) => this.log(`takeover check failed: ${err.message}`));
    }, Math.min(TAKEOVER_CHECK_MS, this.cfg.heartbeatMs));
    this.takeoverTimer.unref();
    this.log(`started with ${this.cfg.slots} slot(s), job expiry ${this.cfg.jobExpireSeconds} s`);
  }

  private async run(): Promise<void> {
    while (!this.stopping) {
      if (this.active < this.cfg.slots) {
        // While waiting for a just-queued run's job, only its queue is asked (one query, not five).
        const next = await this.fetchNext(this.eager > 0 ? RUN_CELL_ONLY : HANDLERS).catch((err: Error) => {
          this.log(`fetch failed: ${err.message}`);
          return null;
        });
        if (next) {
          this.active++;
          void this.execute(next.queue, next.handler, next.job).finally(() => {
            this.active--;
            this.wake?.();
          });
          continue;
        }
      }
      const wait = this.eager > 0 ? EAGER_RETRY_MS << (EAGER_RETRIES - this.eager) : this.cfg.pollMs;
      if (this.eager > 0) this.eager--;
      await new Promise<void>((resolve) => {
        this.wake = resolve;
        setTimeout(resolve, wait);
      });
      this.wake = null;
    }
  }

  private async fetchNext(
    handlers: ReadonlyArray<[QueueName, JobHandler<never>]>,
  ): Promise<{ queue: QueueName; handler: JobHandler<never>; job: PgBoss.JobWithMetadata<never> } | null> {
    for (const [queue, handler] of handlers) {
      const jobs = (await this.boss.fetch(queue, { batchSize: 1, includeMetadata: true })) as PgBoss.JobWithMetadata<never>[] | null;
      if (jobs && jobs.length) return { queue, handler, job: jobs[0] };
    }
    return null;
  }

  private async execute(queue: QueueName, handler: JobHandler<never>, job: PgBoss.JobWithMetadata<never>): Promise<void> {
    this.inFlight.set(job.id, queue);
    this.heartbeat.current = `${queue}:${job.id}`;
    void this.heartbeat.beat().catch(() => undefined);
    try {
      await handler(this.ctx, job);
      await this.boss.complete(queue, job.id);
      await this.heartbeat.jobDone().catch(() => undefined);
    } catch (err) {
      const message = err instanceof Error ? err.message : String(err);
      if ((err as { code?: string }).code === LOCKED_NOTEBOOK) {
        // The notebook was locked meanwhile: its rows are frozen, so the result cannot be stored.
        // Retrying would not help; the run is closed as failed with the reason (the lock trigger
        // lets an unfinished run be closed), so it never stays queued.
        this.log(`${queue} job ${job.id}: ${message}; result not stored`);
        await this.giveUp(queue, job, `the notebook was locked before the result could be stored (${message})`).catch((e: Error) =>
          this.log(`could not mark the run failed: ${e.message}`),
        );
        await this.boss.complete(queue, job.id).catch(() => undefined);
        return;
      }
      this.log(`${queue} job ${job.id} failed (attempt ${job.retryCount + 1} of ${job.retryLimit + 1}): ${message}`);
      await this.boss.fail(queue, job.id, { message }).catch(() => undefined);
      if (job.retryCount >= job.retryLimit) await this.giveUp(queue, job, message).catch(() => undefined);
    } finally {
      this.inFlight.delete(job.id);
      this.heartbeat.current = null;
    }
  }

  /** After the last retry, mark what the job was for as failed so nobody waits for it forever. */
  private async giveUp(queue: QueueName, job: PgBoss.JobWithMetadata<never>, message: string): Promise<void> {
    const data = job.data as { runId?: string; computationId?: string | null };
    if (queue === QUEUES.runCell && data.runId) {
      await this.db.query(
        `UPDATE runs SET status = 'failed', finished_at = now(), error = $2 WHERE id = $1 AND status IN ('queued', 'running')`,
        [data.runId, JSON.stringify({ kind: 'internal', message: `the runner could not execute the cell or store its result: ${message}` })],
      );
    } else if (data.computationId) {
      await this.db.query(
        `UPDATE computations SET status = 'failed', finished_at = now(), error = $2 WHERE id = $1 AND status IN ('queued', 'running')`,
        [data.computationId, message.slice(0, 1000)],
      );
      await this.db.query(
        `UPDATE wheel_levels SET status = 'failed' WHERE computation_id = $1 AND status <> 'stored'`,
        [data.computationId],
      );
    }
  }

  /** Stops taking jobs, lets running ones finish (up to `graceMs`), hands the rest back, closes everything. */
  async stop(graceMs = this.cfg.stopGraceMs): Promise<void> {
    this.stopping = true;
    if (this.takeoverTimer) clearInterval(this.takeoverTimer);
    this.wake?.();
    await this.loop;
    const until = Date.now() + graceMs;
    while (this.active > 0 && Date.now() < until) await sleep(100);
    // Jobs still running are handed back now rather than after their expiry: failed jobs are
    // retried by the other runners (handlers are idempotent; a re-claimed run starts afresh).
    if (this.inFlight.size) {
      // Release the runs first, so that a handler still finishing here cannot store a result.
      await this.db
        .query(`UPDATE runs SET status = 'queued', runner_id = NULL, progress = 0, progress_note = NULL WHERE runner_id = $1 AND status = 'running'`, [
          this.cfg.runnerId,
        ])
        .catch(() => undefined);
    }
    for (const [id, queue] of this.inFlight) {
      this.log(`handing ${queue} job ${id} back to the queue`);
      await this.boss.fail(queue, id, { message: `runner ${this.cfg.runnerId} stopped` }).catch(() => undefined);
    }
    await this.heartbeat.stop();
    await this.wakeup.stop();
    await this.boss.stop({ graceful: false, close: true, wait: true }).catch(() => undefined);
    await this.ctx.executor.close();
    await this.db.end();
    this.log('stopped');
  }
}

import { Inject, Injectable, Logger, OnModuleDestroy, OnModuleInit } from '@nestjs/common';
import type { ConfigType } from '@nestjs/config';
import PgBoss from 'pg-boss';
import { QUEUES, type QueueName } from '@cribra/contracts';
import { appConfig } from '../config/app.config';
import { jobOptions } from './queue-options';

/**
 * The API's handle on pg-boss (schema `pgboss` in the main database): it only sends and cancels;
 * runners consume and run the maintenance that expires jobs of dead runners.
 */
@Injectable()
export class QueueService implements OnModuleInit, OnModuleDestroy {
  private readonly logger = new Logger('Queue');
  readonly boss: PgBoss;

  constructor(@Inject(appConfig.KEY) cfg: ConfigType<typeof appConfig>) {
    this.boss = new PgBoss({ connectionString: cfg.databaseUrl, schema: 'pgboss', supervise: false, schedule: false, max: 4 });
    this.boss.on('error', (err) => this.logger.error(`pg-boss: ${err.message}`));
  }

  async onModuleInit(): Promise<void> {
    await this.boss.start();
    await ensureQueues(this.boss);
  }

  async onModuleDestroy(): Promise<void> {
    await this.boss.stop({ graceful: false, close: true, wait: true });
  }

  /** Sends a job; returns its id. */
  async send(queue: QueueName, data: object, options: PgBoss.SendOptions = {}): Promise<string> {
    const id = await this.boss.send(queue, data, { ...jobOptions(), ...options });
    if (!id) throw new Error(`The queue ${queue} refused the job`);
    return id;
  }

  async cancel(queue: QueueName, jobId: string): Promise<void> {
    await this.boss.cancel(queue, jobId);
  }
}

/** Creates our queues once (pg-boss 10 needs a queue before the first send). */
export async function ensureQueues(boss: PgBoss): Promise<void> {
  const existing = new Set((await boss.getQueues()).map((q) => q.name));
  for (const name of Object.values(QUEUES)) {
    if (!existing.has(name)) {
      try {
        await boss.createQueue(name, { name, ...jobOptions() });
      } catch (err) {
        // Another process created it at the same moment.
        if (!(await boss.getQueue(name))) throw err;
      }
    }
  }
}

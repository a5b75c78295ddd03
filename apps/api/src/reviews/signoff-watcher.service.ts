import { Inject, Injectable, Logger, OnModuleDestroy, OnModuleInit } from '@nestjs/common';
import type { ConfigType } from '@nestjs/config';
import type { Notification } from 'pg';
import { appConfig } from '../config/app.config';
import { PgListener } from '@cribra/pg-listen';
import { ReviewsService } from './reviews.service';

const FINAL = new Set(['succeeded', 'failed', 'cancelled']);
/** Changes of one notebook arriving within this window are reconciled once. */
const DEBOUNCE_MS = 250;

/**
 * Voids sign-offs as soon as a notebook changes: listens to the notifications the notebooks
 * migration sends (`cribra_notebooks` on every revision bump, `cribra_runs` on run changes) and
 * reconciles that notebook. Reads reconcile too, so a missed notification only delays the e-mail.
 */
@Injectable()
export class SignoffWatcherService implements OnModuleInit, OnModuleDestroy {
  private readonly logger = new Logger('SignoffWatcher');
  private readonly listener: PgListener;
  private closing = false;
  private readonly pending = new Map<string, NodeJS.Timeout>();

  constructor(
    @Inject(appConfig.KEY) cfg: ConfigType<typeof appConfig>,
    private readonly reviews: ReviewsService,
  ) {
    this.listener = new PgListener({ databaseUrl: cfg.databaseUrl, channels: ['cribra_notebooks', 'cribra_runs'], onNotification: (msg) => this.heard(msg), log: this.logger });
  }

  async onModuleInit(): Promise<void> {
    await this.listener.start().catch((e) => this.logger.warn(`Could not listen for notebook changes: ${(e as Error).message}`));
  }

  private heard(msg: Notification): void {
    try {
      const p = JSON.parse(msg.payload ?? '{}') as { notebookId?: string; status?: string };
      if (!p.notebookId) return;
      if (msg.channel === 'cribra_runs' && !FINAL.has(p.status ?? '')) return;
      this.schedule(p.notebookId);
    } catch {
      /* not ours to judge */
    }
  }

  private schedule(notebookId: string): void {
    if (this.closing || this.pending.has(notebookId)) return;
    const t = setTimeout(() => {
      this.pending.delete(notebookId);
      void this.reviews.reconcile(notebookId).catch((e) => this.logger.warn(`reconcile ${notebookId}: ${(e as Error).message}`));
    }, DEBOUNCE_MS);
    t.unref();
    this.pending.set(notebookId, t);
  }

  async onModuleDestroy(): Promise<void> {
    this.closing = true;
    for (const t of this.pending.values()) clearTimeout(t);
    this.pending.clear();
    await this.listener.stop();
  }
}

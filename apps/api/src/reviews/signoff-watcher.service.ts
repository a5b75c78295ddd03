import { Inject, Injectable, Logger, OnModuleDestroy, OnModuleInit } from '@nestjs/common';
import type { ConfigType } from '@nestjs/config';
import { Client } from 'pg';
import { appConfig } from '../config/app.config';
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
  private client: Client | null = null;
  private closing = false;
  private reconnecting = false;
  private readonly pending = new Map<string, NodeJS.Timeout>();

  constructor(
    @Inject(appConfig.KEY) private readonly cfg: ConfigType<typeof appConfig>,
    private readonly reviews: ReviewsService,
  ) {}

  async onModuleInit(): Promise<void> {
    await this.connect().catch((e) => this.logger.warn(`Could not listen for notebook changes: ${(e as Error).message}`));
  }

  private async connect(): Promise<void> {
    const client = new Client({ connectionString: this.cfg.databaseUrl });
    client.on('notification', (msg) => {
      try {
        const p = JSON.parse(msg.payload ?? '{}') as { notebookId?: string; status?: string };
        if (!p.notebookId) return;
        if (msg.channel === 'cribra_runs' && !FINAL.has(p.status ?? '')) return;
        this.schedule(p.notebookId);
      } catch {
        /* not ours to judge */
      }
    });
    client.on('error', (err) => {
      // One lost connection may raise several errors; only the current client schedules a retry.
      if (this.client !== client && this.client !== null) return;
      this.logger.warn(`Notification connection lost (${err.message}); reconnecting`);
      this.client = null;
      void client.end().catch(() => undefined);
      this.reconnectSoon();
    });
    try {
      await client.connect();
      await client.query('LISTEN cribra_notebooks');
      await client.query('LISTEN cribra_runs');
    } catch (e) {
      void client.end().catch(() => undefined);
      throw e;
    }
    this.client = client;
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

  /** Retries every second until connected: a database restart may take longer than one try. */
  private reconnectSoon(): void {
    if (this.closing || this.reconnecting) return;
    this.reconnecting = true;
    setTimeout(() => {
      this.reconnecting = false;
      if (this.closing || this.client) return;
      void this.connect().catch((e: Error) => {
        this.logger.warn(`Could not listen again (${e.message}); retrying`);
        this.reconnectSoon();
      });
    }, 1000).unref();
  }

  async onModuleDestroy(): Promise<void> {
    this.closing = true;
    for (const t of this.pending.values()) clearTimeout(t);
    this.pending.clear();
    await this.client?.end().catch(() => undefined);
  }
}

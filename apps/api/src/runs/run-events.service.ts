import { Inject, Injectable, Logger, OnModuleDestroy, OnModuleInit } from '@nestjs/common';
import type { ConfigType } from '@nestjs/config';
import { Client } from 'pg';
import { Observable, Subject, filter, interval, map, merge } from 'rxjs';
import type { NotebookEvent, RunProgressEvent } from '@cribra/contracts';
import { appConfig } from '../config/app.config';

/** Shape Nest's @Sse() expects. */
export interface SseMessage {
  type?: string;
  data: object | string;
}

/**
 * Listens to PostgreSQL notifications (`cribra_runs` from a trigger on runs, `cribra_notebooks`
 * from a trigger on notebook revisions) and fans them out as server-sent events. Runners on other
 * machines only write rows; every API process hears them through the database.
 */
@Injectable()
export class RunEventsService implements OnModuleInit, OnModuleDestroy {
  private readonly logger = new Logger('RunEvents');
  private readonly events = new Subject<NotebookEvent>();
  private client: Client | null = null;
  private closing = false;
  private reconnecting = false;

  constructor(@Inject(appConfig.KEY) private readonly cfg: ConfigType<typeof appConfig>) {}

  async onModuleInit(): Promise<void> {
    await this.connect();
  }

  private async connect(): Promise<void> {
    const client = new Client({ connectionString: this.cfg.databaseUrl });
    client.on('notification', (msg) => {
      if (!msg.payload) return;
      try {
        const payload = JSON.parse(msg.payload);
        if (msg.channel === 'cribra_runs') this.events.next({ type: 'run', run: payload as RunProgressEvent });
        else this.events.next({ type: 'notebook', notebookId: payload.notebookId, revision: payload.revision });
      } catch {
        this.logger.warn(`Ignored a malformed notification on ${msg.channel}`);
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
      await client.query('LISTEN cribra_runs');
      await client.query('LISTEN cribra_notebooks');
    } catch (e) {
      void client.end().catch(() => undefined);
      throw e;
    }
    this.client = client;
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
    }, 1000);
  }

  async onModuleDestroy(): Promise<void> {
    this.closing = true;
    this.events.complete();
    await this.client?.end().catch(() => undefined);
  }

  private notebookId(e: NotebookEvent): string {
    return e.type === 'run' ? e.run.notebookId : e.notebookId;
  }

  /** Events of one notebook (or one run), with a comment-like ping every 20 s to keep proxies open. */
  stream(notebookId: string, runId?: string): Observable<SseMessage> {
    const own = this.events.pipe(
      filter((e) => this.notebookId(e) === notebookId),
      filter((e) => !runId || (e.type === 'run' && e.run.id === runId)),
      map((e): SseMessage => ({ type: e.type, data: e })),
    );
    const ping = interval(20_000).pipe(map((): SseMessage => ({ type: 'ping', data: {} })));
    return merge(own, ping);
  }
}

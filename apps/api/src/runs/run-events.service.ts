import { Inject, Injectable, Logger, OnModuleDestroy, OnModuleInit } from '@nestjs/common';
import type { ConfigType } from '@nestjs/config';
import type { Notification } from 'pg';
import { Observable, Subject, filter, interval, map, merge } from 'rxjs';
import type { NotebookEvent, NotebookStateTopic, RunProgressEvent } from '@cribra/contracts';
import { appConfig } from '../config/app.config';
import { PgListener } from '@cribra/pg-listen';

/** Shape Nest's @Sse() expects. */
export interface SseMessage {
  type?: string;
  data: object | string;
}

/**
 * Listens to PostgreSQL notifications (`cribra_runs` from a trigger on runs, `cribra_notebooks`
 * from a trigger on notebook revisions, `cribra_notebook_state` from triggers on status, reviews,
 * re-verifications, locks and members) and fans them out as server-sent events. Runners on other
 * machines only write rows; every API process hears them through the database.
 */
@Injectable()
export class RunEventsService implements OnModuleInit, OnModuleDestroy {
  private readonly logger = new Logger('RunEvents');
  private readonly events = new Subject<NotebookEvent>();
  private readonly listener: PgListener;

  constructor(@Inject(appConfig.KEY) cfg: ConfigType<typeof appConfig>) {
    this.listener = new PgListener({ databaseUrl: cfg.databaseUrl, channels: ['cribra_runs', 'cribra_notebooks', 'cribra_notebook_state'], onNotification: (msg) => this.heard(msg), log: this.logger });
  }

  async onModuleInit(): Promise<void> {
    await this.listener.start();
  }

  private heard(msg: Notification): void {
    if (!msg.payload) return;
    try {
      const payload = JSON.parse(msg.payload);
      if (msg.channel === 'cribra_runs') this.events.next({ type: 'run', run: payload as RunProgressEvent });
      else if (msg.channel === 'cribra_notebook_state') this.events.next({ type: 'state', notebookId: payload.notebookId, topic: payload.topic as NotebookStateTopic });
      else this.events.next({ type: 'notebook', notebookId: payload.notebookId, revision: payload.revision });
    } catch {
      this.logger.warn(`Ignored a malformed notification on ${msg.channel}`);
    }
  }

  async onModuleDestroy(): Promise<void> {
    this.events.complete();
    await this.listener.stop();
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

  /**
   * One run's events, starting with its state now: a light run may be finished before its
   * subscriber arrives. Live events are heard from before the state is read and follow it, so none
   * falls between the two (one heard while reading may repeat an older state; the last one sent is
   * always the newest).
   */
  streamRun(notebookId: string, runId: string, current: () => Promise<RunProgressEvent>): Observable<SseMessage> {
    const live = this.stream(notebookId, runId);
    return new Observable<SseMessage>((subscriber) => {
      const waiting: SseMessage[] = [];
      let started = false;
      const sub = live.subscribe({
        next: (m) => (started ? subscriber.next(m) : waiting.push(m)),
        error: (e) => subscriber.error(e),
        complete: () => subscriber.complete(),
      });
      current().then(
        (run) => {
          subscriber.next({ type: 'run', data: { type: 'run', run } satisfies NotebookEvent });
          for (const m of waiting.splice(0)) subscriber.next(m);
          started = true;
        },
        (e: unknown) => subscriber.error(e),
      );
      return () => sub.unsubscribe();
    });
  }
}

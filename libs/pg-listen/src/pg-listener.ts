import { Client, type Notification } from 'pg';

/** Where a listener reports lost and regained connections. */
export interface PgListenerLog {
  warn(message: string): void;
}

export interface PgListenerOptions {
  readonly databaseUrl: string;
  readonly channels: readonly string[];
  readonly onNotification: (msg: Notification) => void;
  /**
   * Called after every (re)connection, once LISTEN is in place: notifications sent while nobody
   * listened are lost, so a caller that must not miss one looks for the work itself here.
   */
  readonly onListening?: () => void;
  readonly log: PgListenerLog;
}

/**
 * One PostgreSQL connection that LISTENs on a few channels and comes back by itself: after a lost
 * connection it retries every second until the database answers (a restart may take longer than
 * one try). Used by every process that hears notifications, so the reconnect logic lives once.
 */
export class PgListener {
  private client: Client | null = null;
  private closing = false;
  private reconnecting = false;

  constructor(private readonly options: PgListenerOptions) {}

  /** Connects and listens; rejects when this first attempt fails (the caller decides what that means). */
  start(): Promise<void> {
    return this.connect();
  }

  /** Connects and listens; when the database does not answer, logs it and keeps retrying every second (never rejects). */
  async startOrRetry(): Promise<void> {
    await this.connect().catch((e: Error) => {
      this.options.log.warn(`Could not listen yet (${e.message}); retrying`);
      this.reconnectSoon();
    });
  }

  async stop(): Promise<void> {
    this.closing = true;
    const client = this.client;
    this.client = null;
    await client?.end().catch(() => undefined);
  }

  private async connect(): Promise<void> {
    const client = new Client({ connectionString: this.options.databaseUrl });
    client.on('notification', (msg) => this.options.onNotification(msg));
    client.on('error', (err) => {
      // One lost connection may raise several errors; only the current client schedules a retry.
      if (this.client !== client && this.client !== null) return;
      this.options.log.warn(`Notification connection lost (${err.message}); reconnecting`);
      this.client = null;
      void client.end().catch(() => undefined);
      this.reconnectSoon();
    });
    try {
      await client.connect();
      for (const channel of this.options.channels) await client.query(`LISTEN ${channel}`);
    } catch (e) {
      void client.end().catch(() => undefined);
      throw e;
    }
    if (this.closing) {
      await client.end().catch(() => undefined);
      return;
    }
    this.client = client;
    this.options.onListening?.();
  }

  /** Retries every second until connected. */
  private reconnectSoon(): void {
    if (this.closing || this.reconnecting) return;
    this.reconnecting = true;
    setTimeout(() => {
      this.reconnecting = false;
      if (this.closing || this.client) return;
      void this.connect().catch((e: Error) => {
        this.options.log.warn(`Could not listen again (${e.message}); retrying`);
        this.reconnectSoon();
      });
    }, 1000).unref();
  }
}

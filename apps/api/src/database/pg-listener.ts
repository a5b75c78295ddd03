import type { Logger } from '@nestjs/common';
import { Client, type Notification } from 'pg';

/**
 * One PostgreSQL connection that LISTENs on a few channels and comes back by itself: after a lost
 * connection it retries every second until the database answers (a restart may take longer than
 * one try). Used by every service that hears notifications, so the reconnect logic lives once.
 */
export class PgListener {
  private client: Client | null = null;
  private closing = false;
  private reconnecting = false;

  constructor(
    private readonly databaseUrl: string,
    private readonly channels: readonly string[],
    private readonly onNotification: (msg: Notification) => void,
    private readonly logger: Logger,
  ) {}

  /** Connects and listens; rejects when this first attempt fails (the caller decides what that means). */
  start(): Promise<void> {
    return this.connect();
  }

  async stop(): Promise<void> {
    this.closing = true;
    await this.client?.end().catch(() => undefined);
  }

  private async connect(): Promise<void> {
    const client = new Client({ connectionString: this.databaseUrl });
    client.on('notification', (msg) => this.onNotification(msg));
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
      for (const channel of this.channels) await client.query(`LISTEN ${channel}`);
    } catch (e) {
      void client.end().catch(() => undefined);
      throw e;
    }
    this.client = client;
  }

  /** Retries every second until connected. */
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
}

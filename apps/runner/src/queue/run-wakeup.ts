import { Client } from 'pg';

/**
 * Wakes the runner when a run is queued, so that a light cell starts within milliseconds instead of
 * at the next poll: the runs table's trigger notifies `cribra_runs` on every insert and update, and
 * a queued insert is the signal. One LISTEN connection; when it is lost the runner keeps polling and
 * this tries again every second.
 */
export class RunWakeup {
  private client: Client | null = null;
  private stopped = false;

  constructor(
    private readonly databaseUrl: string,
    private readonly onQueued: () => void,
    private readonly log: (message: string) => void,
  ) {}

  /** Listens; when the database does not answer, logs it and tries again every second (never throws). */
  async start(): Promise<void> {
    await this.connect().catch((err: Error) => {
      this.log(`no run notifications yet (${err.message}); polling meanwhile`);
      this.retry();
    });
  }

  private async connect(): Promise<void> {
    const client = new Client({ connectionString: this.databaseUrl });
    client.on('notification', (msg) => {
      // Progress updates of running cells come on the same channel; only new runs matter here.
      if (queued(msg.payload)) this.onQueued();
    });
    client.on('error', (err) => {
      if (this.client !== client) return;
      this.client = null;
      void client.end().catch(() => undefined);
      this.log(`run notifications lost (${err.message}); polling until they are back`);
      this.retry();
    });
    try {
      await client.connect();
      await client.query('LISTEN cribra_runs');
    } catch (e) {
      void client.end().catch(() => undefined);
      throw e;
    }
    this.client = client;
    this.log('listening for new runs');
    // Runs queued while nobody listened (before the start, or during a lost connection) sent
    // their notification into the void: look once now.
    this.onQueued();
  }

  async stop(): Promise<void> {
    this.stopped = true;
    const client = this.client;
    this.client = null;
    await client?.end().catch(() => undefined);
  }

  private retry(): void {
    if (this.stopped) return;
    setTimeout(() => {
      if (this.stopped || this.client) return;
      this.connect().catch(() => this.retry());
    }, 1000).unref();
  }
}

function queued(payload: string | undefined): boolean {
  try {
    return (JSON.parse(payload ?? '') as { status?: unknown }).status === 'queued';
  } catch {
    return false;
  }
}

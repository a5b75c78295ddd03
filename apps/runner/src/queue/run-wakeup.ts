import { PgListener } from '@cribra/pg-listen';

/**
 * Wakes the runner when a run is queued, so that a light cell starts within milliseconds instead of
 * at the next poll: the runs table's trigger notifies `cribra_runs` on every insert and update, and
 * a queued insert is the signal. One LISTEN connection; when it is lost the runner keeps polling and
 * the listener tries again every second.
 */
export class RunWakeup {
  private readonly listener: PgListener;

  constructor(databaseUrl: string, onQueued: () => void, log: (message: string) => void) {
    this.listener = new PgListener({
      databaseUrl,
      channels: ['cribra_runs'],
      // Progress updates of running cells come on the same channel; only new runs matter here.
      onNotification: (msg) => {
        if (queued(msg.payload)) onQueued();
      },
      onListening: () => {
        log('listening for new runs');
        // Runs queued while nobody listened (before the start, or during a lost connection) sent
        // their notification into the void: look once now.
        onQueued();
      },
      log: { warn: (message) => log(`run notifications: ${message}; polling meanwhile`) },
    });
  }

  /** Listens; when the database does not answer, logs it and tries again every second (never throws). */
  start(): Promise<void> {
    return this.listener.startOrRetry();
  }

  stop(): Promise<void> {
    return this.listener.stop();
  }
}

function queued(payload: string | undefined): boolean {
  try {
    return (JSON.parse(payload ?? '') as { status?: unknown }).status === 'queued';
  } catch {
    return false;
  }
}

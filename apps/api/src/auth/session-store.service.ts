import { Inject, Injectable, Logger, OnApplicationShutdown } from '@nestjs/common';
import type { ConfigType } from '@nestjs/config';
import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import { Pool } from 'pg';
import { appConfig } from '../config/app.config';

const TOUCH_EVERY_MS = 60_000;

/** Sessions live in PostgreSQL (table `session`, created by a migration), so they survive restarts. */
@Injectable()
export class SessionStoreService implements OnApplicationShutdown {
  private readonly pool: Pool;
  private readonly logger = new Logger('Sessions');
  readonly store: session.Store & { close(): void };

  constructor(@Inject(appConfig.KEY) cfg: ConfigType<typeof appConfig>) {
    this.pool = new Pool({ connectionString: cfg.databaseUrl, max: 4 });
    // An idle connection cut by a database restart is reported here; without a listener the pool's
    // 'error' event would end the whole API process. The pool opens a new connection on next use.
    this.pool.on('error', (err) => this.logger.warn(`session store connection lost: ${err.message}`));
    const PgStore = connectPgSimple(session);
    const store = new PgStore({ pool: this.pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 15 * 60 });
    // The cookie rolls (two weeks after the last request), but writing the session row on every
    // request cost one database write per request. Extend the stored expiry at most once a minute
    // per session and process: the row then expires at most a minute before the cookie would.
    const touch = store.touch.bind(store);
    const lastTouch = new Map<string, number>();
    store.touch = (sid, sess, fn) => {
      const now = Date.now();
      if (now - (lastTouch.get(sid) ?? 0) < TOUCH_EVERY_MS) return fn?.();
      if (lastTouch.size > 10_000) for (const [k, t] of lastTouch) if (now - t >= TOUCH_EVERY_MS) lastTouch.delete(k);
      lastTouch.set(sid, now);
      touch(sid, sess, fn);
    };
    this.store = store;
  }

  async onApplicationShutdown(): Promise<void> {
    this.store.close();
    await this.pool.end();
  }
}

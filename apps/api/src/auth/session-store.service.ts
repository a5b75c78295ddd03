import { Inject, Injectable, Logger, OnApplicationShutdown } from '@nestjs/common';
import type { ConfigType } from '@nestjs/config';
import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import { Pool } from 'pg';
import { appConfig } from '../config/app.config';

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
    this.store = new PgStore({ pool: this.pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 15 * 60 });
  }

  async onApplicationShutdown(): Promise<void> {
    this.store.close();
    await this.pool.end();
  }
}

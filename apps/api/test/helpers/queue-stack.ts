import type { INestApplication } from '@nestjs/common';
import { ChildProcess, spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { Client as PgClient } from 'pg';
import { DataSource } from 'typeorm';
import { makeDataSourceOptions } from '../../src/database/data-source';
import { createTestApp } from './test-app';

const ROOT = join(__dirname, '..', '..', '..', '..');
export const RUNNER_MAIN = join(ROOT, 'apps/runner/dist/main.js');

/** Short queue timings for tests: a dead runner's job comes back within a few seconds. */
export const TEST_QUEUE_ENV = {
  CRIBRA_JOB_EXPIRE_SECONDS: '5',
  CRIBRA_QUEUE_MAINTENANCE_SECONDS: '1',
  CRIBRA_RUNNER_POLL_MS: '100',
  CRIBRA_RUNNER_HEARTBEAT_MS: '500',
  CRIBRA_RUNNER_SLOTS: '1',
};

/**
 * A database of its own (created, migrated, dropped afterwards) with an API app on it, so that
 * runners started by a test are the only ones taking its jobs (the launcher's runner serves the
 * shared test database).
 */
export class QueueStack {
  readonly name = `cribra_queue_${randomBytes(4).toString('hex')}`;
  readonly url: string;
  app!: INestApplication;
  db!: DataSource;
  private readonly admin: PgClient;
  private readonly runners: ChildProcess[] = [];
  private readonly byId = new Map<string, ChildProcess>();
  readonly logs = new Map<string, string>();
  private savedEnv: Record<string, string | undefined> = {};

  constructor() {
    const base = new URL(process.env.DATABASE_OWNER_URL ?? process.env.DATABASE_URL!);
    this.admin = new PgClient({ connectionString: Object.assign(new URL(base), { pathname: '/postgres' }).toString() });
    // A test may restart PostgreSQL under this idle connection; stop() then drops with a new one.
    this.admin.on('error', () => undefined);
    this.url = Object.assign(new URL(base), { pathname: `/${this.name}` }).toString();
  }

  async start(): Promise<void> {
    if (!existsSync(RUNNER_MAIN)) throw new Error(`${RUNNER_MAIN} is missing: build with \`npx tsc -b\` first`);
    // The API process sends jobs with these options too.
    for (const [k, v] of Object.entries(TEST_QUEUE_ENV)) {
      this.savedEnv[k] = process.env[k];
      process.env[k] = v;
    }
    await this.admin.connect();
    await this.admin.query(`CREATE DATABASE ${this.name}`);
    const ds = new DataSource({ ...makeDataSourceOptions(this.url), logging: ['error'] });
    await ds.initialize();
    await ds.runMigrations({ transaction: 'each' });
    await ds.destroy();
    this.app = await createTestApp({ databaseUrl: this.url });
    this.db = this.app.get(DataSource);
  }

  /** Starts a runner process on this database; `extra` may set e.g. CRIBRA_RUNNER_TEST_PAUSE_MS. */
  startRunner(id: string, extra: Record<string, string> = {}): ChildProcess {
    const child = spawn(process.execPath, [RUNNER_MAIN], {
      env: { ...process.env, ...TEST_QUEUE_ENV, ...extra, DATABASE_URL: this.url, CRIBRA_ENV: 'test', CRIBRA_RUNNER_ID: id },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    this.logs.set(id, '');
    const keep = (b: Buffer) => this.logs.set(id, (this.logs.get(id) ?? '') + b.toString());
    child.stdout!.on('data', keep);
    child.stderr!.on('data', keep);
    this.runners.push(child);
    this.byId.set(id, child);
    return child;
  }

  async stopRunner(child: ChildProcess, signal: NodeJS.Signals = 'SIGTERM'): Promise<void> {
    if (child.exitCode !== null || child.signalCode !== null) return;
    const gone = new Promise<void>((resolve) => child.once('exit', () => resolve()));
    child.kill(signal);
    await gone;
  }

  /** Stops the runners started under these ids (clean stop, SIGTERM). */
  async stopRunnersNamed(ids: string[]): Promise<void> {
    await Promise.all(ids.map((id) => this.byId.get(id)).filter((c): c is ChildProcess => !!c).map((c) => this.stopRunner(c)));
  }

  async stop(): Promise<void> {
    await Promise.all(this.runners.map((r) => this.stopRunner(r, 'SIGTERM')));
    await this.app?.close();
    // Without FORCE: a connection some component still holds keeps the database (in the throwaway
    // test cluster) instead of being killed under it, which would surface as an unhandled error.
    const dropped = await this.admin.query(`DROP DATABASE IF EXISTS ${this.name}`).then(() => true, () => false);
    await this.admin.end().catch(() => undefined);
    if (!dropped) {
      const again = new PgClient({ connectionString: Object.assign(new URL(process.env.DATABASE_OWNER_URL ?? process.env.DATABASE_URL!), { pathname: '/postgres' }).toString() });
      again.on('error', () => undefined);
      await again.connect().then(() => again.query(`DROP DATABASE IF EXISTS ${this.name}`)).catch(() => undefined);
      await again.end().catch(() => undefined);
    }
    for (const [k, v] of Object.entries(this.savedEnv)) {
      if (v === undefined) delete process.env[k];
      else process.env[k] = v;
    }
  }
}

/** Polls `probe` until it returns a value (not undefined) or the time is up. */
export async function waitFor<T>(what: string, probe: () => Promise<T | undefined>, timeoutMs = 30_000, everyMs = 150): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const v = await probe();
    if (v !== undefined) return v;
    if (Date.now() > until) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}

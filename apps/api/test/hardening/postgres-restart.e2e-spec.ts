// PostgreSQL stopped for 3 s and started again (pg_ctl stop -m fast: every connection is cut) while runs are queued and
// running: the API and the runner reconnect on their own, every run ends (succeeded, or failed
// with a clear reason), new work is taken, and nothing committed before the restart is lost.
import type { INestApplication } from '@nestjs/common';
import { execFileSync } from 'node:child_process';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { Client as PgClient } from 'pg';
import request from 'supertest';
import type { RunView } from '@cribra/contracts';
import { addCell, createNotebook, person, type Person } from '../helpers/notebooks';
import { QueueStack, waitFor } from '../helpers/queue-stack';

/** pg_ctl of the newest installed server, run as the cluster's owner (postgres when we are root). */
function pgCtl(args: string[]): void {
  const base = '/usr/lib/postgresql';
  const version = readdirSync(base).filter((v) => existsSync(join(base, v, 'bin', 'pg_ctl'))).sort((a, b) => Number(b) - Number(a))[0];
  const bin = join(base, version!, 'bin', 'pg_ctl');
  const asRoot = process.getuid?.() === 0;
  execFileSync(asRoot ? 'runuser' : bin, asRoot ? ['-u', 'postgres', '--', bin, ...args] : args, { stdio: ['ignore', 'ignore', 'pipe'], timeout: 60_000 });
}

/** The server's own command-line options (postmaster.opts), for a start after a stop. */
function serverOptions(dir: string): string {
  const args = [...readFileSync(join(dir, 'postmaster.opts'), 'utf8').matchAll(/"([^"]*)"/g)].map((m) => m[1]!);
  const out: string[] = [];
  // The binary's path is written unquoted; the arguments are quoted.
  for (let i = 0; i < args.length; i++) {
    if (args[i] === '-D') i++;
    else out.push(`'${args[i]!.replace(/'/g, `'\\''`)}'`);
  }
  return out.join(' ');
}

async function listeners(db: string): Promise<number> {
  const c = new PgClient({ connectionString: process.env.DATABASE_OWNER_URL ?? process.env.DATABASE_URL });
  await c.connect();
  try {
    return (await c.query(`SELECT count(*)::int AS n FROM pg_stat_activity WHERE datname = $1 AND query ILIKE 'LISTEN%'`, [db])).rows[0].n as number;
  } finally {
    await c.end();
  }
}

async function dataDirectory(): Promise<string> {
  const c = new PgClient({ connectionString: process.env.DATABASE_OWNER_URL ?? process.env.DATABASE_URL });
  await c.connect();
  try {
    return (await c.query('SHOW data_directory')).rows[0].data_directory as string;
  } finally {
    await c.end();
  }
}

const finished = (r: RunView) => r.status === 'succeeded' || r.status === 'failed' || r.status === 'cancelled';

describe('PostgreSQL restarted under load', () => {
  const stack = new QueueStack();
  let app: INestApplication;
  let owner: Person;

  beforeAll(async () => {
    await stack.start();
    app = stack.app;
    owner = await person(app, 'pgrestart');
  }, 60_000);
  afterAll(async () => {
    await stack.stop();
  });

  it('API and runner reconnect, runs end with a result or a clear reason, committed writes stay', async () => {
    const nb = await createNotebook(owner, { title: 'Written before the restart' });
    const cells = [];
    for (let k = 5; k <= 12; k++) cells.push(await addCell(owner, nb.id, `primorial(${[5, 7, 11, 13, 17, 19, 23, 29][k - 5]})`));
    // Each job pauses 1.5 s after it starts: some runs are running and others queued at the restart.
    const runner = stack.startRunner('restart-runner', { CRIBRA_RUNNER_TEST_PAUSE_MS: '1500', CRIBRA_RUNNER_SLOTS: '2' });
    const queued = (await owner.client.call('post', `/api/notebooks/${nb.id}/runs`)).body.runs as RunView[];
    expect(queued).toHaveLength(cells.length);
    await waitFor('a run to be running', async () => {
      const r = (await owner.client.call('get', `/api/runs/${queued[0]!.id}`)).body as RunView;
      return r.status === 'running' ? true : undefined;
    });

    const dir = await dataDirectory();
    const opts = serverOptions(dir);
    const listening = await listeners(stack.name);
    expect(listening).toBeGreaterThanOrEqual(2); // run events and the sign-off watcher
    // Down for 3 s: longer than one reconnection attempt of any component.
    const cut = Date.now();
    pgCtl(['-D', dir, '-m', 'fast', '-w', '-t', '60', 'stop']);
    await new Promise((r) => setTimeout(r, 3_000));
    pgCtl(['-D', dir, '-l', join(dir, 'server.log'), '-w', '-t', '60', '-o', opts, 'start']);
    const downMs = Date.now() - cut;

    // The API answers again (its pool drops dead connections and opens new ones).
    const healthy = await waitFor('the API to report the database up', async () => {
      const res = await request(app.getHttpServer()).get('/api/health');
      return res.status === 200 && res.body.database === 'up' ? Date.now() - cut : undefined;
    }, 30_000, 200);

    // Every run ends; a run cut mid-way is retried or fails with a stated reason, never hangs.
    const done: RunView[] = [];
    for (const q of queued) {
      done.push(await waitFor(`run ${q.id} to end`, async () => {
        const r = (await owner.client.call('get', `/api/runs/${q.id}`)).body as RunView;
        return finished(r) ? r : undefined;
      }, 90_000, 250));
    }
    for (const r of done) {
      if (r.status === 'succeeded') expect(r.outputs?.length).toBe(1);
      else expect(r.error?.message).toMatch(/\w{4,}/);
    }
    expect(done.filter((r) => r.status === 'succeeded').length).toBeGreaterThan(0);
    // 29# = 6469693230 (OEIS A002110), when that run succeeded.
    const last = done[done.length - 1]!;
    if (last.status === 'succeeded') expect(last.outputs![0]).toMatchObject({ text: '6469693230' });

    // The API listens for notifications again (progress events to browsers, sign-off watcher).
    await waitFor('the LISTEN connections to return', async () => ((await listeners(stack.name)) >= listening ? true : undefined), 20_000, 250);

    // The runner is still alive and takes new work.
    expect(runner.exitCode).toBeNull();
    const fresh = await addCell(owner, nb.id, 'admissible({0, 2, 6, 8, 12})');
    const run = (await owner.client.call('post', `/api/cells/${fresh.id}/runs`)).body as RunView;
    const after = await waitFor('a run queued after the restart', async () => {
      const r = (await owner.client.call('get', `/api/runs/${run.id}`)).body as RunView;
      return finished(r) ? r : undefined;
    }, 60_000, 250);
    expect(after).toMatchObject({ status: 'succeeded', outputs: [expect.objectContaining({ text: 'true' })] });

    // Nothing committed before the restart is lost.
    const back = (await owner.client.call('get', `/api/notebooks/${nb.id}`)).body;
    expect(back.title).toBe('Written before the restart');
    expect(back.cells.map((c: { id: string }) => c.id)).toEqual([...cells.map((c) => c.id), fresh.id]);
    console.log(
      `postgres restart: database down for ${downMs} ms (stop, 3 s, start); API healthy ${healthy} ms after the cut; ` +
        `${done.filter((r) => r.status === 'succeeded').length} of ${done.length} in-flight runs succeeded, ` +
        `${done.filter((r) => r.status !== 'succeeded').length} failed with a reason; runner alive`,
    );
  }, 180_000);
});

import { primeBlockToJson, sievePrimeBlock, wheelLevelStats } from '@cribra/engine';
import { LEDGER_CONSTELLATIONS, type ComputationView, type LedgerRangeView, type RunView, type WheelLevelView } from '@cribra/contracts';
import { addCell, createNotebook, person, type Person } from './helpers/notebooks';
import { QueueStack, waitFor } from './helpers/queue-stack';

/**
 * The queue under stress: a runner killed mid-job, and chunked computations shared by two runners
 * that must equal the single-process result.
 */
/** Chunk jobs pause this long on test runners, so that two runners both take part. */
const SHARE_PAUSE = { CRIBRA_RUNNER_TEST_PAUSE_MS: '700' };

describe('queue and runners', () => {
  const stack = new QueueStack();
  let owner: Person;

  beforeAll(async () => {
    await stack.start();
    owner = await person(stack.app, 'qowner');
  }, 60_000);
  afterAll(async () => {
    await stack.stop();
  });

  const sql = <T = Record<string, unknown>>(text: string, params: unknown[] = []): Promise<T[]> => stack.db.query(text, params);
  /** Waits until the run is running on the given runner. */
  const takenBy = (runId: string, runnerId: string) =>
    waitFor(`runner ${runnerId} to take the run`, async () => {
      const [r] = await sql<{ status: string; runner_id: string }>(`SELECT status, runner_id FROM runs WHERE id = $1`, [runId]);
      return r.status === 'running' && r.runner_id === runnerId ? true : undefined;
    });
  /** Waits until the run has succeeded or failed, and returns it as the API shows it. */
  const finished = (runId: string, what: string, timeoutMs: number, everyMs?: number) =>
    waitFor(
      what,
      async () => {
        const r = (await owner.client.call('get', `/api/runs/${runId}`)).body as RunView;
        return r.status === 'succeeded' || r.status === 'failed' ? r : undefined;
      },
      timeoutMs,
      everyMs,
    );

  it('starts a queued run at once on an idle runner, woken by the run notification rather than its poll', async () => {
    // The idle poll is a minute here: only the notification can explain a start within seconds.
    const idle = stack.startRunner('wake-a', { CRIBRA_RUNNER_POLL_MS: '60000' });
    await waitFor('the runner to listen for new runs', async () => (/listening for new runs/.test(stack.logs.get('wake-a') ?? '') ? true : undefined), 45_000);
    await new Promise((r) => setTimeout(r, 1000)); // past its first fetches: it now sleeps for a minute
    const nb = await createNotebook(owner);
    const cell = await addCell(owner, nb.id, 'primorial(13)');
    const queued = (await owner.client.call('post', `/api/cells/${cell.id}/runs`)).body as RunView;
    // Generous for a loaded machine; the start time below is the real check.
    const run = await finished(queued.id, 'the run to finish', 40_000, 50).catch((e: Error) => {
      throw new Error(`${e.message}\nrunner log:\n${stack.logs.get('wake-a')}`);
    });
    expect(run).toMatchObject({ status: 'succeeded', runnerId: 'wake-a' });
    expect(run.outputs).toEqual([expect.objectContaining({ kind: 'value', text: '30030' })]); // 13# = 30030 (OEIS A002110)
    const [{ ms }] = await sql<{ ms: number }>(`SELECT extract(epoch FROM started_at - queued_at) * 1000 AS ms FROM runs WHERE id = $1`, [queued.id]);
    expect(Number(ms)).toBeLessThan(10_000);
    await stack.stopRunner(idle);
  }, 90_000);

  it('finishes a run on another runner after its runner is killed (SIGKILL), counted once', async () => {
    const nb = await createNotebook(owner);
    const cell = await addCell(owner, nb.id, 'primorial(17)');
    // Runner A pauses 6 s inside every job, so it surely dies mid-job.
    const a = stack.startRunner('kill-a', { CRIBRA_RUNNER_TEST_PAUSE_MS: '6000' });
    const queued = (await owner.client.call('post', `/api/cells/${cell.id}/runs`)).body as RunView;
    await takenBy(queued.id, 'kill-a');
    await stack.stopRunner(a, 'SIGKILL');
    stack.startRunner('kill-b');

    const run = await finished(queued.id, 'the run to finish on runner B', 45_000);
    expect(run).toMatchObject({ status: 'succeeded', runnerId: 'kill-b', attempts: 2 });
    expect(run.outputs).toEqual([expect.objectContaining({ kind: 'value', text: '510510' })]); // 17# = 510510 (OEIS A002110)
    // Counted once: one run row for the cell, one completed job, A never finished anything.
    expect(await sql(`SELECT count(*)::int AS n FROM runs WHERE cell_id = $1`, [cell.id])).toEqual([{ n: 1 }]);
    const [{ job_id: jobId }] = await sql<{ job_id: string }>(`SELECT job_id FROM runs WHERE id = $1`, [queued.id]);
    // The job is completed right after the run row is written: wait for both.
    const jobs = await waitFor('the job to be completed', async () => {
      const rows = await sql<{ state: string; retry_count: number }>(
        `SELECT state, retry_count FROM pgboss.job WHERE id = $1 UNION ALL SELECT state, retry_count FROM pgboss.archive WHERE id = $1`,
        [jobId],
      );
      return rows.length === 1 && rows[0].state === 'completed' ? rows : undefined;
    });
    // Retried at least once (after A died); a slow cold start of B's worker may add a retry that
    // then finds the run already finished and does nothing.
    expect(jobs[0].retry_count).toBeGreaterThanOrEqual(1);
    const runners = await waitFor('runner B to count its job', async () => {
      const rows = await sql<{ id: string; jobs_done: number; stopped_at: Date | null }>(
        `SELECT id, jobs_done, stopped_at FROM runners WHERE id IN ('kill-a', 'kill-b') ORDER BY id`,
      );
      return rows.length === 2 && rows[1].jobs_done > 0 ? rows : undefined;
    });
    expect(runners[0]).toMatchObject({ id: 'kill-a', jobs_done: 0 });
    expect(runners[1].id).toBe('kill-b');
    expect(runners[0].stopped_at).toBeNull(); // died without a clean stop
  }, 60_000);

  it('hands its running jobs back at once when a runner is stopped (SIGTERM) before they finish', async () => {
    await stack.stopRunnersNamed(['kill-b']);
    const nb = await createNotebook(owner);
    const cell = await addCell(owner, nb.id, 'primorial(19)');
    // A long expiry for this job: only the hand-back can make it finish within the test's wait.
    const saved = process.env.CRIBRA_JOB_EXPIRE_SECONDS;
    process.env.CRIBRA_JOB_EXPIRE_SECONDS = '120';
    const a = stack.startRunner('stop-a', { CRIBRA_RUNNER_TEST_PAUSE_MS: '20000', CRIBRA_RUNNER_STOP_GRACE_MS: '300' });
    const queued = (await owner.client.call('post', `/api/cells/${cell.id}/runs`)).body as RunView;
    process.env.CRIBRA_JOB_EXPIRE_SECONDS = saved;
    await takenBy(queued.id, 'stop-a');
    await stack.stopRunner(a, 'SIGTERM');
    expect(stack.logs.get('stop-a')).toContain('back to the queue');
    stack.startRunner('kill-b');
    const run = await finished(queued.id, 'the run to finish on runner B', 40_000);
    expect(run).toMatchObject({ status: 'succeeded', runnerId: 'kill-b', attempts: 2 });
    const [a2] = await sql<{ stopped_at: Date | null }>(`SELECT stopped_at FROM runners WHERE id = 'stop-a'`);
    expect(a2.stopped_at).not.toBeNull();
  }, 60_000);

  it('takes a killed runner\'s run over through its heartbeat within seconds, not after the job expiry, counted once', async () => {
    await stack.stopRunnersNamed(['kill-b']);
    const nb = await createNotebook(owner);
    const cell = await addCell(owner, nb.id, 'primorial(23)');
    // A 10-minute expiry: only the heartbeat-based takeover can bring the run back in time.
    const saved = process.env.CRIBRA_JOB_EXPIRE_SECONDS;
    process.env.CRIBRA_JOB_EXPIRE_SECONDS = '600';
    const long = { CRIBRA_JOB_EXPIRE_SECONDS: '600', CRIBRA_RUNNER_DEAD_AFTER_SECONDS: '3' };
    const a = stack.startRunner('hb-a', { ...long, CRIBRA_RUNNER_TEST_PAUSE_MS: '60000' });
    const queued = (await owner.client.call('post', `/api/cells/${cell.id}/runs`)).body as RunView;
    process.env.CRIBRA_JOB_EXPIRE_SECONDS = saved;
    await takenBy(queued.id, 'hb-a');
    stack.startRunner('hb-b', long);
    await waitFor('runner B to register', async () => ((await sql(`SELECT 1 FROM runners WHERE id = 'hb-b'`)).length ? true : undefined));
    const killedAt = Date.now();
    await stack.stopRunner(a, 'SIGKILL');
    await takenBy(queued.id, 'hb-b');
    const takeoverMs = Date.now() - killedAt;
    const run = await finished(queued.id, 'the run to finish on runner B', 40_000);
    expect(run).toMatchObject({ status: 'succeeded', runnerId: 'hb-b', attempts: 2 });
    expect(run.outputs).toEqual([expect.objectContaining({ kind: 'value', text: '223092870' })]); // 23# = 223092870 (OEIS A002110)
    expect(takeoverMs).toBeLessThan(20_000); // dead after 3 s, checked every 0.5 s, retried after 1 s
    expect(await sql(`SELECT count(*)::int AS n FROM runs WHERE cell_id = $1`, [cell.id])).toEqual([{ n: 1 }]);
    const [dead] = await sql<{ taken_over_by: string | null; current_job: string | null; active_jobs: unknown[] }>(
      `SELECT taken_over_by, current_job, active_jobs FROM runners WHERE id = 'hb-a'`,
    );
    expect(dead).toMatchObject({ taken_over_by: 'hb-b', current_job: null });
    expect(stack.logs.get('hb-b')).toMatch(/took over runner hb-a .*1 run\(s\)/);
    const listed = (await owner.client.call('get', '/api/runners')).body as Array<{ id: string; alive: boolean; currentJob: string | null }>;
    expect(listed.find((r) => r.id === 'hb-a')).toMatchObject({ alive: false, currentJob: null });
    await stack.stopRunnersNamed(['hb-b']);
  }, 90_000);

  it('computes a ledger range in blocks shared by two runners, equal to one single-process sieve', async () => {
    // Each block job pauses a little so that neither runner can drain the queue alone.
    await stack.stopRunnersNamed(['kill-b']);
    stack.startRunner('share-b', SHARE_PAUSE);
    stack.startRunner('share-c', SHARE_PAUSE);
    await waitFor('both runners', async () => {
      const rows = await sql(`SELECT id FROM runners WHERE id IN ('share-b', 'share-c') AND stopped_at IS NULL`);
      return rows.length === 2 ? true : undefined;
    });
    const to = 60_000_000;
    const requested = await owner.client.call('post', '/api/ledger/computations', { from: '0', to: String(to) });
    expect(requested.status).toBe(202);
    expect(requested.body).toMatchObject({ kind: 'ledger', chunksTotal: 6 });
    const done = await waitFor(
      'the ledger computation',
      async () => {
        const c = (await owner.client.call('get', `/api/computations/${requested.body.id}`)).body as ComputationView;
        return c.status === 'succeeded' || c.status === 'failed' ? c : undefined;
      },
      90_000,
      300,
    );
    expect(done).toMatchObject({ status: 'succeeded', chunksDone: 6 });
    const by = await sql<{ computed_by: string }>(`SELECT DISTINCT computed_by FROM ledger_blocks ORDER BY 1`);
    expect(by.map((r) => r.computed_by)).toEqual(['share-b', 'share-c']);

    const range = (await owner.client.call('get', `/api/ledger/range?from=0&to=${to}`)).body as LedgerRangeView;
    const single = primeBlockToJson(sievePrimeBlock(0, to - 1, { gaps: true, patterns: Object.values(LEDGER_CONSTELLATIONS).map((p) => [...p]) }));
    expect(range.complete).toBe(true);
    expect(range.primeCount).toBe(String(single.primeCount));
    expect(range.gapHistogram).toEqual(
      Object.entries(single.gaps!.histogram)
        .map(([gap, count]) => ({ gap: Number(gap), count: String(count) }))
        .sort((x, y) => x.gap - y.gap),
    );
    const counts = Object.fromEntries(Object.keys(LEDGER_CONSTELLATIONS).map((name, i) => [name, String(single.patterns[i].count)]));
    expect(range.constellations).toEqual(counts);
    const records = single.gaps!.records;
    expect(range.largestGap).toEqual({ gap: records[records.length - 1].gap, start: records[records.length - 1].after });

    // π(10^7) = 664579 (OEIS A006880) and 58980 twin prime pairs below 10^7 (OEIS A007508); values from memory.
    const block0 = (await owner.client.call('get', '/api/ledger/blocks/0')).body;
    expect(block0).toMatchObject({ index: 0, start: '0', end: '10000000', primeCount: '664579' });
    expect(block0.constellations.twin).toBe('58980');
  }, 120_000);

  /** Requests a level computation and waits until the level is stored. */
  async function computeLevel(prime: number): Promise<WheelLevelView> {
    const requested = await owner.client.call('post', `/api/levels/${prime}/computations`);
    expect(requested.status).toBe(202);
    return waitFor(
      `level ${prime} to be stored`,
      async () => {
        const l = await owner.client.call('get', `/api/levels/${prime}`);
        return l.status === 200 && l.body.status === 'stored' ? (l.body as WheelLevelView) : undefined;
      },
      60_000,
      300,
    );
  }

  /** The stored level equals the engine's direct enumeration: largest gap, histogram, pair tallies. */
  function expectEnumeratedLevel(level: WheelLevelView): void {
    const single = wheelLevelStats(level.prime, [2]);
    expect(level.largestGap).toBe(single.maxGap);
    expect(level.histogram).toEqual([...single.histogram].map(([gap, count]) => ({ gap, count: count.toString() })));
    expect(level.patternTallies).toEqual([
      { length: 2, entries: [...single.patterns.get(2)!].map(([k, count]) => ({ pattern: k.split(',').map(Number), count: count.toString() })) },
    ]);
  }

  it('streams a wheel level in chunks on two runners, equal to the one-piece enumeration', async () => {
    // Only how the work is cut changes: 17# streamed over 13# in chunks of at most 20 000 steps.
    const knobs = { CRIBRA_LEVEL_ONE_PIECE_UP_TO: '13', CRIBRA_LEVEL_STEPS_PER_CHUNK: '20000', ...SHARE_PAUSE };
    stack.startRunner('level-d', knobs);
    stack.startRunner('level-e', knobs);
    // Leave the level jobs to the two runners with the knobs.
    await stack.stopRunnersNamed(['share-b', 'share-c']);
    const level = await computeLevel(17);
    expect(level.chunksTotal).toBeGreaterThan(1);
    const chunkRunners = stack.logs.get('level-d')!.includes('chunk') && stack.logs.get('level-e')!.includes('chunk');
    expect(chunkRunners).toBe(true);
    // 17# = 510510 (OEIS A002110), φ(17#) = 92160 (OEIS A005867)
    expect(level).toMatchObject({ prime: 17, modulus: '510510', phi: '92160' });
    expectEnumeratedLevel(level);
    // Jacobsthal function of 17#: the largest gap of level 17 is 26 (OEIS A048670; value from memory).
    expect(level.largestGap).toBe(26);
  }, 90_000);

  it('computes a wheel level by recursion from chunked quadruple tallies of the level before, equal to the enumeration', async () => {
    // 19# from the gap quadruples of 17# (streamed over 13# in chunks of at most 20 000 steps), then
    // the pair recursion; the level itself is never walked.
    const knobs = { CRIBRA_LEVEL_ONE_PIECE_UP_TO: '13', CRIBRA_LEVEL_STEPS_PER_CHUNK: '20000', CRIBRA_LEVEL_RECURSION_FROM: '19', ...SHARE_PAUSE };
    stack.startRunner('level-f', knobs);
    stack.startRunner('level-g', knobs);
    await stack.stopRunnersNamed(['level-d', 'level-e']);
    const level = await computeLevel(19);
    // 17# = 17 copies of the 13# cycle: 17·5760 steps in 5 chunks of at most 20 000.
    expect(level.chunksTotal).toBe(5);
    const logs = stack.logs.get('level-f')! + stack.logs.get('level-g')!;
    expect(logs).toContain('by recursion from the quadruples of 17# over 13#');
    expect(logs).toContain('(quadruples of 17#)');
    expect(stack.logs.get('level-f')!.includes('chunk') && stack.logs.get('level-g')!.includes('chunk')).toBe(true);
    // 19# = 9699690 (OEIS A002110), φ(19#) = 1658880 (OEIS A005867)
    expect(level).toMatchObject({ prime: 19, modulus: '9699690', phi: '1658880' });
    expectEnumeratedLevel(level);
    // Jacobsthal function of 19#: the largest gap of level 19 is 34 (OEIS A048670; value from memory).
    expect(level.largestGap).toBe(34);
  }, 90_000);

  it('computes a wheel level by the split route in chunks on two runners, equal to the enumeration', async () => {
    // 23# by the split route over the members of 17# (primes 19 and 23 by inclusion–exclusion per window),
    // cut into 6 chunks of base members; each chunk gives partial counts of every gap.
    const knobs = { CRIBRA_LEVEL_SPLIT_FROM: '23', CRIBRA_LEVEL_SPLIT_CHUNKS: '6', ...SHARE_PAUSE };
    stack.startRunner('level-h', knobs);
    stack.startRunner('level-i', knobs);
    await stack.stopRunnersNamed(['level-f', 'level-g']);
    const level = await computeLevel(23);
    expect(level.chunksTotal).toBe(6);
    const logs = stack.logs.get('level-h')! + stack.logs.get('level-i')!;
    expect(logs).toContain('by the split route over the members of 17#');
    expect(logs).toContain('(split route over 17#)');
    expect(stack.logs.get('level-h')!.includes('chunk') && stack.logs.get('level-i')!.includes('chunk')).toBe(true);
    // 23# = 223092870 (OEIS A002110), φ(23#) = 36495360 (OEIS A005867); Jacobsthal 40 (OEIS A048670)
    expect(level).toMatchObject({ prime: 23, modulus: '223092870', phi: '36495360', largestGap: 40, patternTallies: [] });
    const single = wheelLevelStats(23, []);
    expect(level.histogram).toEqual([...single.histogram].map(([gap, count]) => ({ gap, count: count.toString() })));
  }, 90_000);

  it('serves people fairly: another person\'s single run goes before the rest of one person\'s flood', async () => {
    await stack.stopRunnersNamed(['level-h', 'level-i']);
    const other = await person(stack.app, 'qother');
    const nb = await createNotebook(owner);
    const flood = await addCell(owner, nb.id, 'primorial(11)');
    const theirs = await createNotebook(other);
    const light = await addCell(other, theirs.id, 'primorial(13)');
    // No runner yet: the flood of 6 runs is queued first, then the other person's one run.
    const floodRuns: RunView[] = [];
    for (let i = 0; i < 6; i++) floodRuns.push((await owner.client.call('post', `/api/cells/${flood.id}/runs`)).body as RunView);
    const single = (await other.client.call('post', `/api/cells/${light.id}/runs`)).body as RunView;
    // One runner with one slot, a pause in each run: the order it takes them is the queue's order.
    stack.startRunner('fair-a', { CRIBRA_RUNNER_TEST_PAUSE_MS: '300' });
    const done = await waitFor(
      'the other person\'s run',
      async () => {
        const [r] = await sql<{ status: string }>(`SELECT status FROM runs WHERE id = $1`, [single.id]);
        return r.status === 'succeeded' || r.status === 'failed' ? r : undefined;
      },
      60_000,
    );
    expect(done.status).toBe('succeeded');
    const order = await sql<{ id: string }>(
      `SELECT id FROM runs WHERE id = ANY($1::uuid[]) AND started_at IS NOT NULL ORDER BY started_at`,
      [[...floodRuns.map((r) => r.id), single.id]],
    );
    const position = order.findIndex((r) => r.id === single.id);
    // FIFO would make it the 7th; the flood's first run (priority 0) and the single run (priority 0)
    // come before the flood's others (priorities −1 … −5).
    expect(position).toBeLessThanOrEqual(1);
    await stack.stopRunnersNamed(['fair-a']);
  }, 90_000);
});

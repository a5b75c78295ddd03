import type { ComputationView, LedgerRangeView, RunnerView, WheelLevelSummary, WheelLevelView } from '@cribra/contracts';
import { Pool } from 'pg';
import { PgDataProvider } from '../../runner/src/data/pg-data-provider';
import { NO_SUCH_ID, person, type Person } from './helpers/notebooks';
import { QueueStack, waitFor } from './helpers/queue-stack';
import { Client } from './helpers/test-app';

/** Stored wheel levels, the prime ledger and their computations, with one runner. */
describe('levels, ledger and computations', () => {
  const stack = new QueueStack();
  let me: Person;

  beforeAll(async () => {
    await stack.start();
    stack.startRunner('levels-a');
    me = await person(stack.app, 'levels');
  }, 60_000);
  afterAll(async () => {
    await stack.stop();
  });

  const finished = (id: string) =>
    waitFor(
      `computation ${id}`,
      async () => {
        const c = (await me.client.call('get', `/api/computations/${id}`)).body as ComputationView;
        return c.status === 'succeeded' || c.status === 'failed' ? c : undefined;
      },
      40_000,
      200,
    );

  it('computes and stores wheel levels on request, once', async () => {
    const first = await me.client.call('post', '/api/levels/11/computations');
    expect(first.status).toBe(202);
    expect(first.body).toMatchObject({ kind: 'level', params: { prime: 11 }, requestedBy: { id: me.id } });
    const again = await me.client.call('post', '/api/levels/11/computations');
    expect(again.body.id).toBe(first.body.id); // already queued or stored: the same computation
    expect(await finished(first.body.id)).toMatchObject({ status: 'succeeded', chunksTotal: 1, chunksDone: 1 });
    const level = (await me.client.call('get', '/api/levels/11')).body as WheelLevelView;
    // 11# = 2310 (OEIS A002110), φ(11#) = 480 (OEIS A005867); largest gap 14 (OEIS A048670, from memory).
    expect(level).toMatchObject({ prime: 11, modulus: '2310', phi: '480', largestGap: 14, status: 'stored', computedBy: 'levels-a' });
    expect(level.digest).toMatch(/^[0-9a-f]{64}$/);
    const total = level.histogram.reduce((s, h) => s + BigInt(h.count), 0n);
    expect(total).toBe(480n); // one gap per member over a period
    expect(level.patternTallies.map((t) => t.length)).toEqual([2, 3]);
    for (const t of level.patternTallies) expect(t.entries.reduce((s, e) => s + BigInt(e.count), 0n)).toBe(480n);
    const list = (await me.client.call('get', '/api/levels')).body as WheelLevelSummary[];
    expect(list.map((l) => l.prime)).toContain(11);
    expect((await me.client.call('post', '/api/levels/11/computations')).body.id).toBe(first.body.id);

    // What a Sift cell sees through the runner's data provider: the same level, with exact bigints.
    const pool = new Pool({ connectionString: stack.url, max: 1 });
    try {
      const provider = new PgDataProvider(pool, { notebookId: NO_SUCH_ID, runnerId: 'test', maxInlineBlocks: 0, requestLedger: async () => undefined, onNote: () => undefined });
      const seen = await provider.level(11);
      expect(seen).toMatchObject({ prime: 11, modulus: 2310n, phi: 480n, largestGap: 14 }); // sources as above (A002110, A005867, A048670)
      expect(seen!.histogram).toEqual(level.histogram.map((h) => ({ gap: h.gap, count: BigInt(h.count) })));
      expect(await provider.level(13)).toBeNull();
      expect(await provider.upload('none')).toBeNull();
    } finally {
      await pool.end();
    }
  });

  it('computes level 41 through the runner by the split route: Jacobsthal value 74 (OEIS A048670)', async () => {
    const req = await me.client.call('post', '/api/levels/41/computations');
    expect(req.status).toBe(202);
    expect(await finished(req.body.id)).toMatchObject({ status: 'succeeded', chunksTotal: 32, chunksDone: 32 });
    const level = (await me.client.call('get', '/api/levels/41')).body as WheelLevelView;
    // 41# = 304250263527210 (OEIS A002110), φ(41#) = 44144787456000 (OEIS A005867)
    expect(level).toMatchObject({ prime: 41, modulus: '304250263527210', phi: '44144787456000', largestGap: 74, status: 'stored', patternTallies: [] });
    // the runner checked both identities before storing; check them again on what was stored
    expect(level.histogram.reduce((s, h) => s + BigInt(h.count), 0n)).toBe(44144787456000n);
    expect(level.histogram.reduce((s, h) => s + BigInt(h.gap) * BigInt(h.count), 0n)).toBe(304250263527210n);
    // n2 = ∏_{3 ≤ q ≤ 41}(q − 2) (OEIS A059861)
    expect(level.histogram[0]).toEqual({ gap: 2, count: [3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37, 41].reduce((s, q) => s * BigInt(q - 2), 1n).toString() });
  }, 60_000);

  it('refuses levels that are not primes or too deep (400) and unknown ones (404)', async () => {
    const bad = await me.client.call('post', '/api/levels/12/computations');
    expect(bad.status).toBe(400);
    expect(bad.body.details).toEqual([{ field: 'prime', messages: [expect.stringContaining('not a prime')] }]);
    expect((await me.client.call('post', '/api/levels/53/computations')).status).toBe(400);
    expect((await me.client.call('post', '/api/levels/seven/computations')).status).toBe(400);
    expect((await me.client.call('get', '/api/levels/13')).status).toBe(404);
    expect((await me.client.call('get', `/api/computations/${NO_SUCH_ID}`)).status).toBe(404);
    expect((await new Client(stack.app).call('get', '/api/levels')).status).toBe(401);
  });

  it('stores ledger blocks, lists and reads them, and combines a range', async () => {
    const req = await me.client.call('post', '/api/ledger/computations', { from: '0', to: '15000000' });
    expect(req.status).toBe(202);
    expect(req.body.chunksTotal).toBe(2);
    expect(await finished(req.body.id)).toMatchObject({ status: 'succeeded', chunksDone: 2 });
    const list = await me.client.call('get', '/api/ledger/blocks?from=0&to=20000000');
    expect(list.body).toMatchObject({ total: 2, page: 1 });
    expect(list.body.items.map((b: { index: number }) => b.index)).toEqual([0, 1]);
    const block = (await me.client.call('get', '/api/ledger/blocks/1')).body;
    expect(block).toMatchObject({ index: 1, start: '10000000', end: '20000000', computedBy: 'levels-a' });
    expect(block.gapHistogram.length).toBeGreaterThan(10);
    // π(2·10^7) = 1270607 (OEIS A006880 neighbourhood; value from memory).
    const range = (await me.client.call('get', '/api/ledger/range?from=0&to=20000000')).body as LedgerRangeView;
    expect(range).toMatchObject({ complete: true, missingBlocks: [], primeCount: '1270607' });
    const partial = (await me.client.call('get', '/api/ledger/range?from=0&to=30000000')).body as LedgerRangeView;
    expect(partial).toMatchObject({ complete: false, missingBlocks: [2], primeCount: null });
    // A request for stored blocks only is finished at once.
    const again = await me.client.call('post', '/api/ledger/computations', { from: '5', to: '19999999' });
    expect(again.body).toMatchObject({ status: 'succeeded', chunksTotal: 2, chunksDone: 2 });
    const kinds = (await me.client.call('get', '/api/computations?kind=ledger')).body as ComputationView[];
    expect(kinds.every((c) => c.kind === 'ledger')).toBe(true);
    // The runner that did the work shows up with its heartbeat.
    const runners = (await me.client.call('get', '/api/runners')).body as RunnerView[];
    expect(runners).toEqual([expect.objectContaining({ id: 'levels-a', alive: true, stoppedAt: null, pid: expect.any(Number) })]);
    expect(runners[0].jobsDone).toBeGreaterThanOrEqual(4);
  });

  it('refuses bad ledger ranges (400) and unknown blocks (404)', async () => {
    const reversed = await me.client.call('post', '/api/ledger/computations', { from: '100', to: '10' });
    expect(reversed.status).toBe(400);
    expect(reversed.body.details).toEqual([{ field: 'to', messages: ['to must be greater than from'] }]);
    expect((await me.client.call('post', '/api/ledger/computations', { from: '0', to: '100000000001' })).status).toBe(400);
    expect((await me.client.call('post', '/api/ledger/computations', { from: '-1', to: '10' })).status).toBe(400);
    expect((await me.client.call('get', '/api/ledger/range?from=abc&to=10')).status).toBe(400);
    expect((await me.client.call('get', '/api/ledger/blocks/999')).status).toBe(404);
    expect((await me.client.call('get', '/api/computations?kind=other')).status).toBe(400);
  });
});

// A runner SIGKILLed in the middle of a ledger chunk (block) job: the computation finishes on
// another runner, every block is stored exactly once, and the combined range equals one sieve.
// (queue.e2e-spec.ts kills a runner during a cell run; this is the chunked-computation case.)
import { primeBlockToJson, sievePrimeBlock } from '@cribra/engine';
import type { ComputationView, LedgerRangeView } from '@cribra/contracts';
import { person, type Person } from '../helpers/notebooks';
import { QueueStack, waitFor } from '../helpers/queue-stack';

describe('a runner killed in the middle of a chunk', () => {
  const stack = new QueueStack();
  let owner: Person;

  beforeAll(async () => {
    await stack.start();
    owner = await person(stack.app, 'chunk-kill');
  }, 60_000);
  afterAll(async () => {
    await stack.stop();
  });

  const sql = <T = Record<string, unknown>>(text: string, params: unknown[] = []): Promise<T[]> => stack.db.query(text, params);

  it('finishes the computation elsewhere, nothing lost, nothing counted twice', async () => {
    const to = 30_000_000;
    // Runner A pauses 6 s inside every job, so it is surely killed while a block job is active.
    const a = stack.startRunner('chunk-a', { CRIBRA_RUNNER_TEST_PAUSE_MS: '6000' });
    const requested = await owner.client.call('post', '/api/ledger/computations', { from: '0', to: String(to) });
    expect(requested.status).toBe(202);
    expect(requested.body).toMatchObject({ kind: 'ledger', chunksTotal: 3 });
    await waitFor('runner A to hold a block job', async () => {
      const [r] = await sql<{ n: number }>(`SELECT count(*)::int AS n FROM pgboss.job WHERE name = 'cribra-ledger-block' AND state = 'active'`);
      return r!.n > 0 ? true : undefined;
    }, 45_000, 100);
    await stack.stopRunner(a, 'SIGKILL');
    expect(await sql(`SELECT count(*)::int AS n FROM ledger_blocks`)).toEqual([{ n: 0 }]);
    stack.startRunner('chunk-b');

    const done = await waitFor('the computation on runner B', async () => {
      const c = (await owner.client.call('get', `/api/computations/${requested.body.id}`)).body as ComputationView;
      return c.status === 'succeeded' || c.status === 'failed' ? c : undefined;
    }, 60_000, 250);
    expect(done).toMatchObject({ status: 'succeeded', chunksDone: 3, chunksTotal: 3 });

    // Each block exactly once, all by B (A was killed before it stored anything).
    const blocks = await sql<{ block_index: number; computed_by: string }>(`SELECT block_index, computed_by FROM ledger_blocks ORDER BY block_index`);
    expect(blocks.map((b) => b.block_index)).toEqual([0, 1, 2]);
    expect(new Set(blocks.map((b) => b.computed_by))).toEqual(new Set(['chunk-b']));

    const range = (await owner.client.call('get', `/api/ledger/range?from=0&to=${to}`)).body as LedgerRangeView;
    const single = primeBlockToJson(sievePrimeBlock(0, to - 1, { gaps: true, patterns: [] }));
    expect(range).toMatchObject({ complete: true, primeCount: String(single.primeCount) });
    // π(3·10^7) = 1 857 859 (from memory; the single-process sieve above is the check).
    expect(range.primeCount).toBe('1857859');
  }, 120_000);
});

// A runner SIGKILLed while it holds a ledger chunk (block) job: the computation finishes on another
// runner, every block is stored exactly once, the chunk count is not inflated by the redone block,
// and the combined range equals one sieve.
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
    const to = 100_000_000;
    const a = stack.startRunner('chunk-a');
    const requested = await owner.client.call('post', '/api/ledger/computations', { from: '0', to: String(to) });
    expect(requested.status).toBe(202);
    expect(requested.body).toMatchObject({ kind: 'ledger', chunksTotal: 10 });
    // Kill A the moment it holds a block job (blocks take a fraction of a second each).
    const inFlight = await waitFor('runner A to hold a block job', async () => {
      const rows = await sql<{ block: number }>(`SELECT (data->>'blockIndex')::int AS block FROM pgboss.job WHERE name = 'cribra-ledger-block' AND state = 'active'`);
      return rows.length ? rows[0]!.block : undefined;
    }, 45_000, 10);
    await stack.stopRunner(a, 'SIGKILL');
    const [{ n: storedAtKill }] = await sql<{ n: number }>(`SELECT count(*)::int AS n FROM ledger_blocks`);
    expect(storedAtKill).toBeLessThan(10);
    stack.startRunner('chunk-b');

    const done = await waitFor('the computation on runner B', async () => {
      const c = (await owner.client.call('get', `/api/computations/${requested.body.id}`)).body as ComputationView;
      return c.status === 'succeeded' || c.status === 'failed' ? c : undefined;
    }, 90_000, 250);
    // Counted once: the block A was working on is not added again when B redoes (or skips) it.
    expect(done).toMatchObject({ status: 'succeeded', chunksDone: 10, chunksTotal: 10 });

    const blocks = await sql<{ block_index: number; computed_by: string }>(`SELECT block_index, computed_by FROM ledger_blocks ORDER BY block_index`);
    expect(blocks.map((b) => b.block_index)).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8, 9]);
    expect(blocks.filter((b) => b.computed_by === 'chunk-b').length).toBeGreaterThanOrEqual(10 - storedAtKill - 1);
    expect(blocks.filter((b) => b.block_index === inFlight)).toHaveLength(1);

    const range = (await owner.client.call('get', `/api/ledger/range?from=0&to=${to}`)).body as LedgerRangeView;
    const single = primeBlockToJson(sievePrimeBlock(0, to - 1, { gaps: true, patterns: [] }));
    expect(range).toMatchObject({ complete: true, primeCount: String(single.primeCount) });
    // π(10^8) = 5 761 455 (OEIS A006880).
    expect(range.primeCount).toBe('5761455');
  }, 150_000);
});

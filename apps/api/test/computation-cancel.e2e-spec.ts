import type { ComputationView } from '@cribra/contracts';
import { person, type Person } from './helpers/notebooks';
import { QueueStack, waitFor } from './helpers/queue-stack';
import { Client } from './helpers/test-app';

/** POST /api/computations/:id/cancel with one slowed runner: the rest is skipped, stored blocks stay. */
describe('cancelling a computation', () => {
  const stack = new QueueStack();
  let me: Person;

  beforeAll(async () => {
    await stack.start();
    // Each block waits 400 ms before it starts, so that the cancel lands while blocks remain.
    stack.startRunner('cancel-a', { CRIBRA_RUNNER_TEST_PAUSE_MS: '400', CRIBRA_RUNNER_SLOTS: '1' });
    me = await person(stack.app, 'cancel');
  }, 60_000);
  afterAll(async () => {
    await stack.stop();
  });

  const get = async (id: string) => (await me.client.call('get', `/api/computations/${id}`)).body as ComputationView;
  const storedIn = async (first: number, last: number) =>
    Number((await stack.db.query(`SELECT count(*)::int AS n FROM ledger_blocks WHERE block_index BETWEEN $1 AND $2`, [first, last]))[0].n);

  it('stops a ledger computation between blocks and keeps the blocks already stored', async () => {
    // Blocks 8000..8029: [8·10^10, 8.03·10^10).
    const req = await me.client.call('post', '/api/ledger/computations', { from: '80000000000', to: '80300000000' });
    expect(req.status).toBe(202);
    const id = req.body.id as string;
    await waitFor(`a first block of ${id}`, async () => ((await get(id)).chunksDone >= 1 ? true : undefined), 60_000, 100);
    expect((await get(id)).startedAt).not.toBeNull();

    const cancel = await me.client.call('post', `/api/computations/${id}/cancel`);
    expect(cancel.status).toBe(200);
    expect(cancel.body).toMatchObject({ id, status: 'cancelled' });
    expect(cancel.body.finishedAt).not.toBeNull();

    // A block under way may still finish; after that nothing more is stored.
    await new Promise((r) => setTimeout(r, 2_500));
    const kept = await storedIn(8000, 8029);
    await new Promise((r) => setTimeout(r, 2_500));
    expect(await storedIn(8000, 8029)).toBe(kept);
    expect(kept).toBeGreaterThanOrEqual(1);
    expect(kept).toBeLessThan(30);
    expect(stack.logs.get('cancel-a')).toMatch(new RegExp(`ledger block 80\\d\\d skipped: computation ${id} was cancelled`));
    expect((await get(id)).status).toBe('cancelled');

    // Asking for the range again computes only the missing blocks.
    const again = await me.client.call('post', '/api/ledger/computations', { from: '80000000000', to: '80300000000' });
    expect(again.body).toMatchObject({ chunksTotal: 30, chunksDone: kept });
    await me.client.call('post', `/api/computations/${again.body.id}/cancel`);
  });

  it('refuses to cancel twice (409), unknown ids (404) and the signed-out (401)', async () => {
    const req = await me.client.call('post', '/api/ledger/computations', { from: '81000000000', to: '81100000000' });
    const first = await me.client.call('post', `/api/computations/${req.body.id}/cancel`);
    expect(first.status).toBe(200);
    const twice = await me.client.call('post', `/api/computations/${req.body.id}/cancel`);
    expect(twice.status).toBe(409);
    expect(twice.body.message).toMatch(/already been cancelled/);
    expect((await me.client.call('post', '/api/computations/00000000-0000-4000-8000-000000000000/cancel')).status).toBe(404);
    const anon = new Client(stack.app);
    expect((await anon.call('post', `/api/computations/${req.body.id}/cancel`)).status).toBe(401);
  });
});

import type { AddressInfo } from 'node:net';
import http from 'node:http';
import { outputsDigest, type SiftOutput } from '@cribra/lang';
import type { RunView } from '@cribra/contracts';
import request from 'supertest';
import { CSRF_HEADER } from '@cribra/contracts';
import { addCell, addMember, createNotebook, NO_SUCH_ID, person, type Person } from './helpers/notebooks';
import { QueueStack, waitFor } from './helpers/queue-stack';

/** Runs through the real queue: an API app and one runner process on a database of their own. */
describe('runs', () => {
  const stack = new QueueStack();
  let owner: Person;
  let reviewer: Person;
  let viewer: Person;
  let outsider: Person;
  let notebookId: string;

  beforeAll(async () => {
    await stack.start();
    [owner, reviewer, viewer, outsider] = await Promise.all(['rowner', 'rreviewer', 'rviewer', 'routsider'].map((t) => person(stack.app, t)));
    notebookId = (await createNotebook(owner)).id;
    await addMember(owner, notebookId, reviewer, 'reviewer');
    await addMember(owner, notebookId, viewer, 'viewer');
  }, 60_000);
  afterAll(async () => {
    await stack.stop();
  });

  const getRun = async (id: string): Promise<RunView> => (await owner.client.call('get', `/api/runs/${id}`)).body;
  const finished = (id: string) =>
    waitFor(`run ${id} to finish`, async () => {
      const r = await getRun(id);
      return ['succeeded', 'failed', 'cancelled'].includes(r.status) ? r : undefined;
    });

  it('queues a run (202), keeps it queued without runners, and cancels it', async () => {
    const cell = await addCell(owner, notebookId, 'primorial(7)');
    const res = await reviewer.client.call('post', `/api/cells/${cell.id}/runs`);
    expect(res.status).toBe(202);
    expect(res.body).toMatchObject({ status: 'queued', cellId: cell.id, cellRevision: 1, attempts: 0, requestedBy: { id: reviewer.id } });
    expect((await viewer.client.call('post', `/api/runs/${res.body.id}/cancel`)).status).toBe(403);
    const cancelled = await reviewer.client.call('post', `/api/runs/${res.body.id}/cancel`);
    expect(cancelled.status).toBe(200);
    expect(cancelled.body).toMatchObject({ status: 'cancelled', error: { kind: 'cancelled' } });
    const again = await owner.client.call('post', `/api/runs/${res.body.id}/cancel`);
    expect(again.status).toBe(409);
  });

  it('refuses to queue a cell with syntax errors, listing every one of them (nothing reaches a runner)', async () => {
    const bad = await addCell(owner, notebookId, 'let x = 1 +\nshow (2\nprimorial(5)');
    const res = await owner.client.call('post', `/api/cells/${bad.id}/runs`);
    expect(res.status).toBe(400);
    expect(res.body.message).toMatch(/^The cell has 2 syntax errors; nothing was queued\. line 1, column 12: the statement ends too early.*; line 3, column 1: unexpected 'primorial': expected '\)'$/);
    expect(res.body.details).toEqual([{ field: 'source', messages: [
      expect.stringMatching(/^line 1, column 12: the statement ends too early/),
      "line 3, column 1: unexpected 'primorial': expected ')'",
    ] }]);
    expect((await owner.client.call('get', `/api/cells/${bad.id}/runs`)).body.total).toBe(0);

    const nb = await createNotebook(owner);
    const good = await addCell(owner, nb.id, 'primorial(3)');
    await addCell(owner, nb.id, 'primorial(5) +');
    const all = await owner.client.call('post', `/api/notebooks/${nb.id}/runs`);
    expect(all.status).toBe(400);
    expect(all.body.details).toEqual([{ field: 'cell 2', messages: [expect.stringMatching(/^line 1, column 15: /)] }]);
    expect(all.body.message).toMatch(/^cell 2 has 1 syntax error; nothing was queued\. cell 2, line 1, column 15: /);
    expect((await owner.client.call('get', `/api/cells/${good.id}/runs`)).body.total).toBe(0);
  });

  describe('with a runner', () => {
    beforeAll(() => {
      stack.startRunner('runs-a');
    });

    it('executes end to end: runner → outputs and canonical digest stored, progress streamed as server-sent events', async () => {
      const cell = await addCell(owner, notebookId, 'primorial(13)\ntotient(30030)');
      // Listen to the notebook's event stream on a real port.
      if (!stack.app.getHttpServer().listening) await stack.app.listen(0, '127.0.0.1');
      const port = (stack.app.getHttpServer().address() as AddressInfo).port;
      const events: string[] = [];
      const cookie = [...owner.client.jar].map(([k, v]) => `${k}=${v}`).join('; ');
      const sse = http.get({ host: '127.0.0.1', port, path: `/api/notebooks/${notebookId}/events`, headers: { cookie, accept: 'text/event-stream' } });
      const connected = new Promise<http.IncomingMessage>((resolve) => sse.on('response', resolve));
      const response = await connected;
      expect(response.statusCode).toBe(200);
      expect(response.headers['content-type']).toMatch(/text\/event-stream/);
      response.on('data', (b: Buffer) => events.push(b.toString()));

      const queued = (await owner.client.call('post', `/api/cells/${cell.id}/runs`)).body as RunView;
      const run = await finished(queued.id);
      expect(run).toMatchObject({ status: 'succeeded', progress: 1, runnerId: 'runs-a', attempts: 1, error: null });
      expect(run.outputs).toHaveLength(2);
      expect(run.outputs![0]).toMatchObject({ kind: 'value', text: '30030' }); // 13# = 30030 (OEIS A002110)
      expect(run.outputs![1]).toMatchObject({ kind: 'value', text: '5760' }); // φ(13#) = 5760 (OEIS A005867)
      expect(run.outputDigest).toBe(outputsDigest(run.outputs as unknown as SiftOutput[]));
      expect(run.engineVersion).toMatch(/^\d+\.\d+\.\d+/);
      expect(run.languageVersion).toMatch(/^\d+\.\d+\.\d+/);
      expect(run.durationMs).toBeGreaterThanOrEqual(0);

      await waitFor('the succeeded event', async () => (events.join('').includes('"status":"succeeded"') ? true : undefined), 5000);
      const text = events.join('');
      expect(text).toContain('event: run');
      expect(text).toContain(`"id":"${queued.id}"`);
      sse.destroy();

      const cellView = (await viewer.client.call('get', `/api/cells/${cell.id}`)).body;
      expect(cellView.latestRun).toMatchObject({ id: queued.id, status: 'succeeded' });
    });

    it('streams the events of one run, and refuses streams of unknown runs (404) and outsiders (403)', async () => {
      if (!stack.app.getHttpServer().listening) await stack.app.listen(0, '127.0.0.1');
      const address = stack.app.getHttpServer().address() as AddressInfo;
      const open = (who: Person, path: string) =>
        new Promise<{ res: http.IncomingMessage; req: http.ClientRequest }>((resolve) => {
          const cookie = [...who.client.jar].map(([k, v]) => `${k}=${v}`).join('; ');
          const req = http.get({ host: '127.0.0.1', port: address.port, path, headers: { cookie, accept: 'text/event-stream' } });
          req.on('response', (res) => resolve({ res, req }));
        });
      const cell = await addCell(owner, notebookId, 'primorial(19)');
      const other = await addCell(owner, notebookId, 'primorial(23)');
      const queued = (await owner.client.call('post', `/api/cells/${cell.id}/runs`)).body as RunView;
      const { res, req } = await open(viewer, `/api/runs/${queued.id}/events`);
      expect(res.statusCode).toBe(200);
      let text = '';
      res.on('data', (b: Buffer) => (text += b.toString()));
      const otherRun = (await owner.client.call('post', `/api/cells/${other.id}/runs`)).body as RunView;
      await finished(queued.id);
      await finished(otherRun.id);
      await waitFor('the run event', async () => (text.includes('"status":"succeeded"') ? true : undefined), 5000);
      expect(text).toContain(`"id":"${queued.id}"`);
      expect(text).not.toContain(otherRun.id); // only this run's events
      req.destroy();
      // A subscriber that comes after the end still hears how the run ended (the stream starts with its state).
      const late = await open(viewer, `/api/runs/${queued.id}/events`);
      let lateText = '';
      late.res.on('data', (b: Buffer) => (lateText += b.toString()));
      await waitFor('the late subscriber to hear the end', async () => (lateText.includes('"status":"succeeded"') ? true : undefined), 5000);
      expect(lateText).toContain(`"id":"${queued.id}"`);
      late.req.destroy();
      const unknown = await open(owner, `/api/runs/${NO_SUCH_ID}/events`);
      expect(unknown.res.statusCode).toBe(404);
      unknown.req.destroy();
      const outside = await open(outsider, `/api/notebooks/${notebookId}/events`);
      expect(outside.res.statusCode).toBe(403);
      outside.req.destroy();
    });

    it('records a failing cell with the error and its line', async () => {
      const cell = await addCell(owner, notebookId, 'primorial(5)\nfrobnicate(4)');
      const run = await finished((await owner.client.call('post', `/api/cells/${cell.id}/runs`)).body.id);
      expect(run.status).toBe('failed');
      expect(run.error).toMatchObject({ line: 2 });
      expect(run.outputDigest).toBeNull();
      expect(run.outputs).toHaveLength(1);
    });

    it('runs every query and claim cell in order, and keeps the history', async () => {
      const nb = await createNotebook(owner);
      const a = await addCell(owner, nb.id, 'primorial(3)');
      await addCell(owner, nb.id, 'A note', 'note');
      const c = await addCell(owner, nb.id, 'primorial(5)');
      const all = await owner.client.call('post', `/api/notebooks/${nb.id}/runs`);
      expect(all.status).toBe(202);
      expect(all.body.runs.map((r: RunView) => r.cellId)).toEqual([a.id, c.id]);
      for (const r of all.body.runs) expect((await finished(r.id)).status).toBe('succeeded');
      await owner.client.call('post', `/api/cells/${a.id}/runs`);
      const history = await owner.client.call('get', `/api/cells/${a.id}/runs?pageSize=1`);
      expect(history.body).toMatchObject({ total: 2, page: 1, pageSize: 1 });
      const nbHistory = await viewer.client.call('get', `/api/notebooks/${nb.id}/runs`);
      expect(nbHistory.status).toBe(403); // the viewer is not a member of this notebook
      expect((await owner.client.call('get', `/api/notebooks/${nb.id}/runs`)).body.total).toBe(3);
    });

    it('stops a running cell when it is cancelled, freeing the runner for the next one', async () => {
      const slow = await addCell(owner, notebookId, 'primepi(10^12)');
      const queued = (await owner.client.call('post', `/api/cells/${slow.id}/runs`)).body as RunView;
      await waitFor('the slow run to start', async () => ((await getRun(queued.id)).status === 'running' ? true : undefined));
      const cancelled = await owner.client.call('post', `/api/runs/${queued.id}/cancel`);
      expect(cancelled.body.status).toBe('cancelled');
      const quick = await addCell(owner, notebookId, 'primorial(11)');
      const started = Date.now();
      const next = await finished((await owner.client.call('post', `/api/cells/${quick.id}/runs`)).body.id);
      expect(next.status).toBe('succeeded');
      expect(Date.now() - started).toBeLessThan(20_000); // far below the 60 s limit the slow cell would use
      expect((await getRun(queued.id)).status).toBe('cancelled');
    });

    it('reads uploads and the prime ledger through the PostgreSQL data provider', async () => {
      const token = owner.client.csrf ?? (await owner.client.fetchCsrf());
      const up = await request(stack.app.getHttpServer())
        .post(`/api/notebooks/${notebookId}/uploads`)
        .set('Cookie', [...owner.client.jar].map(([k, v]) => `${k}=${v}`).join('; '))
        .set(CSRF_HEADER, token)
        .attach('file', Buffer.from('# a 5-tuple\n0\n2\n6\n8\n12\n'), { filename: 'quintuple.txt', contentType: 'text/plain' });
      expect(up.status).toBe(201);
      const cell = await addCell(owner, notebookId, 'size(upload("quintuple"))\nledger(0..19999999)');
      const run = await finished((await owner.client.call('post', `/api/cells/${cell.id}/runs`)).body.id);
      expect(run.status).toBe('succeeded');
      expect(run.outputs![0]).toMatchObject({ text: '5' });
      // π(2·10^7) = 1270607 (value from memory; also checked against the engine in levels.e2e-spec).
      expect(run.outputs![1].text).toContain('primes: 1270607');
      // The two whole ledger blocks of the range were missing: the cell computed and stored them.
      const blocks = await stack.db.query(`SELECT block_index, computed_by FROM ledger_blocks ORDER BY block_index`);
      expect(blocks).toEqual([
        { block_index: 0, computed_by: 'runs-a' },
        { block_index: 1, computed_by: 'runs-a' },
      ]);
      const missingUpload = await addCell(owner, notebookId, 'upload("nothing")');
      const failed = await finished((await owner.client.call('post', `/api/cells/${missingUpload.id}/runs`)).body.id);
      expect(failed.error?.message).toContain('no upload named "nothing"');
    });

    it('refuses note cells (400), viewers and outsiders (403) and unknown ids (404)', async () => {
      const note = await addCell(owner, notebookId, 'Just words', 'note');
      const query = await addCell(owner, notebookId, 'primorial(3)');
      expect((await owner.client.call('post', `/api/cells/${note.id}/runs`)).status).toBe(400);
      expect((await viewer.client.call('post', `/api/cells/${query.id}/runs`)).status).toBe(403);
      expect((await viewer.client.call('post', `/api/notebooks/${notebookId}/runs`)).status).toBe(403);
      expect((await outsider.client.call('get', `/api/cells/${query.id}/runs`)).status).toBe(403);
      expect((await owner.client.call('post', `/api/cells/${NO_SUCH_ID}/runs`)).status).toBe(404);
      expect((await owner.client.call('get', `/api/runs/${NO_SUCH_ID}`)).status).toBe(404);
      expect((await owner.client.call('post', `/api/runs/${NO_SUCH_ID}/cancel`)).status).toBe(404);
      expect((await owner.client.call('get', `/api/cells/${query.id}/runs?pageSize=500`)).status).toBe(400);
    });
  });
});

// `npm run bench:load [-- --url=http://127.0.0.1:4310] [--connections=50] [--seconds=10] [--runs=400]`
// Load on a running stack (`npm start`, or any stack with open sign-up and at least one runner):
//  0. N clients working like people: each reads the notebook, or presses *run* on the light cell,
//     once a second, the clients' seconds spread evenly (autocannon, one connection per client);
//     latency of the answer, and for runs the time from queued to finished on the runner; then
//     the largest number of such clients for which the run's p95 stays within the target;
//  1. notebook reads (GET /api/notebooks/:id) — autocannon, N connections back to back (saturation);
//  2. a light cell run accepted (POST /api/cells/:id/runs → 202: run row stored and job queued) —
//     autocannon, N connections, bounded request count;
//  3. a light cell run completed (POST, then the run read until it has succeeded on a runner) —
//     N concurrent clients, bounded run count; and how fast the runners drained the backlog of 2.
// The light cell is an admissibility query on a 50-tuple. Prints p50/p95/p99 and throughput.
// `--only=hardening` runs instead the hostile-load scenarios (issue 19): the latency of an unrelated
// list request while (a) maximal uploads are parsed, (b) a notebook with a 3.9 MB-output run is
// read by 4 clients; and (c) fairness: how long one person's light run waits while another person
// floods the queue with heavier runs.
import autocannon from 'autocannon';
import { BenchClient, admissibleTuple, fmt, summary } from './bench-client.mjs';

const arg = (name, fallback) => process.argv.slice(2).find((a) => a.startsWith(`--${name}=`))?.split('=')[1] ?? fallback;
const BASE = arg('url', process.env.BENCH_URL ?? 'http://127.0.0.1:4310');
const CONNECTIONS = Number(arg('connections', 50));
const SECONDS = Number(arg('seconds', 10));
const RUNS = Number(arg('runs', 400));
const ACCEPTS = Number(arg('accepts', 1000));
const RATE = Number(arg('rate', 50));
const TARGET_MS = 50;
const CAPACITY_STEPS = (arg('capacity', '50,100,150,200,250,300')).split(',').map(Number);

/**
 * `clients` autocannon connections, each sending one request a second for `seconds`, started
 * evenly spread over the first second — independent people rather than one synchronized burst
 * (autocannon's own rate limit restarts every connection's second at the same instant).
 */
async function pacedClients({ clients, seconds, path, method = 'GET', headers }) {
  const times = [];
  const statuses = new Map();
  const started = Date.now();
  await Promise.all(
    Array.from({ length: clients }, (_, i) =>
      new Promise((resolve, reject) => {
        setTimeout(() => {
          const inst = autocannon({ url: `${BASE}${path}`, method, headers, connections: 1, connectionRate: 1, amount: seconds }, (err, res) => (err ? reject(err) : resolve(res)));
          inst.on('response', (_client, status, _bytes, ms) => {
            times.push(ms);
            statuses.set(status, (statuses.get(status) ?? 0) + 1);
          });
        }, (i * 1000) / clients);
      }),
    ),
  );
  return { times, statuses, seconds: (Date.now() - started) / 1000, from: new Date(started) };
}

/** Queued → finished (server clock) of the cell's runs queued at or after `from`, once all have finished. */
async function runDurations(c, cellId, from) {
  for (let wait = 0; wait < 600; wait++) {
    const items = [];
    for (let page = 1; ; page++) {
      const body = (await c.call('GET', `/api/cells/${cellId}/runs?page=${page}&pageSize=100`)).body;
      const batch = (body?.items ?? body ?? []).filter((r) => Date.parse(r.queuedAt) >= from.getTime() - 5);
      items.push(...batch);
      if (batch.length < 100) break;
    }
    if (items.every((r) => r.finishedAt)) return items.map((r) => Date.parse(r.finishedAt) - Date.parse(r.queuedAt));
    await new Promise((res) => setTimeout(res, 500));
  }
  throw new Error('runs did not finish within 5 minutes');
}

function cannon(opts) {
  return new Promise((resolve, reject) => {
    const times = [];
    const statuses = new Map();
    const inst = autocannon({ ...opts, url: `${BASE}${opts.path}` }, (err, result) => (err ? reject(err) : resolve({ result, times, statuses })));
    inst.on('response', (_client, status, _bytes, ms) => {
      times.push(ms);
      statuses.set(status, (statuses.get(status) ?? 0) + 1);
    });
  });
}

/** Multipart upload through fetch (FormData); returns {status, ms}. */
async function uploadFile(c, notebookId, name, text, type) {
  const form = new FormData();
  form.append('file', new Blob([text], { type }), name);
  const t = performance.now();
  const res = await fetch(`${BASE}/api/notebooks/${notebookId}/uploads`, {
    method: 'POST',
    headers: { Cookie: c.cookieHeader(), 'x-csrf-token': c.csrf },
    body: form,
  });
  await res.text();
  return { status: res.status, ms: performance.now() - t };
}

/** Latencies of GET `path` sent back to back by `clients` loops while `busy()` runs. */
async function latencyDuring(c, path, busy, clients = 2) {
  const times = [];
  let done = false;
  const probes = Array.from({ length: clients }, async () => {
    while (!done) {
      const t = performance.now();
      await c.call('GET', path);
      times.push(performance.now() - t);
      await new Promise((r) => setTimeout(r, 20));
    }
  });
  const out = await busy();
  done = true;
  await Promise.all(probes);
  return { times, out };
}

async function waitRunDone(c, id, timeoutMs = 600_000) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const r = await c.call('GET', `/api/runs/${id}`);
    if (['succeeded', 'failed', 'cancelled'].includes(r.body?.status)) return r.body;
    await new Promise((res) => setTimeout(res, 100));
  }
  throw new Error(`run ${id} did not finish`);
}

async function hardening() {
  const c = new BenchClient(BASE);
  await c.signUpFresh('hard');
  await c.fetchCsrf();
  const nb = (await c.call('POST', '/api/notebooks', { title: 'Hardening bench' })).body;
  const list = '/api/notebooks?page=1&pageSize=20';
  const rows = [];
  const idle = await latencyDuring(c, list, () => new Promise((r) => setTimeout(r, 3000)));
  rows.push(['list request, nothing else', summary(idle.times), '']);

  // (a) Maximal uploads: 2 MiB of 10^6 one-digit rows (refused: more than 200 000 rows) and a valid
  // 200 000-row CSV, three of each in turn.
  const refused = 'n\n' + '7\n'.repeat(1_000_000);
  const valid = 'n,m\n' + Array.from({ length: 200_000 }, (_, i) => `${i % 10},${i % 7}`).join('\n').slice(0, 2 * 1024 * 1024 - 10) + '\n';
  const upl = await latencyDuring(c, list, async () => {
    const outs = [];
    for (let i = 0; i < 3; i++) {
      outs.push(await uploadFile(c, nb.id, 'big.csv', refused, 'text/csv'));
      const ok = await uploadFile(c, nb.id, `ok${i}.csv`, valid, 'text/csv');
      outs.push(ok);
    }
    return outs;
  });
  rows.push(['list request during 6 maximal CSV uploads', summary(upl.times), `uploads ${upl.out.map((u) => `${u.status} in ${u.ms.toFixed(0)} ms`).join(', ')}`]);

  // (b) A notebook with one heavy run (just under the per-run output limit) read by 4 clients.
  const heavyNb = (await c.call('POST', '/api/notebooks', { title: 'Heavy outputs' })).body;
  const heavy = (await c.call('POST', `/api/notebooks/${heavyNb.id}/cells`, { kind: 'query', source: 'let x = 2^130000\nshow [x + n : n ∈ 1..50]' })).body;
  const hr = await waitRunDone(c, (await c.call('POST', `/api/cells/${heavy.id}/runs`)).body.id);
  const full = await c.call('GET', `/api/runs/${hr.id}`);
  const readBytes = [];
  const heavyReads = await latencyDuring(c, list, async () => {
    const until = Date.now() + 5000;
    await Promise.all(Array.from({ length: 4 }, async () => {
      while (Date.now() < until) readBytes.push((await c.call('GET', `/api/notebooks/${heavyNb.id}`)).text.length);
    }));
  });
  rows.push([
    'list request while 4 clients read a notebook with a heavy run',
    summary(heavyReads.times),
    `run ${hr.status}, its outputs ${full.text.length} bytes (GET /runs/:id); each notebook read ${readBytes[0]} bytes, ${readBytes.length} reads in 5 s`,
  ]);

  // (c) Fairness: person A queues 20 runs of a cell taking ~0.5–1 s; person B then runs a light cell.
  const a = new BenchClient(BASE);
  await a.signUpFresh('flood');
  await a.fetchCsrf();
  const anb = (await a.call('POST', '/api/notebooks', { title: 'Flood' })).body;
  const slow = (await a.call('POST', `/api/notebooks/${anb.id}/cells`, { kind: 'query', source: 'show #[p ∈ primes 1..3·10^6] p mod 4 = 1' })).body;
  const floodIds = [];
  for (let i = 0; i < 20; i++) floodIds.push((await a.call('POST', `/api/cells/${slow.id}/runs`)).body.id);
  const light = (await c.call('POST', `/api/notebooks/${nb.id}/cells`, { kind: 'query', source: 'show primorial(13)' })).body;
  const t = performance.now();
  const lr = await waitRunDone(c, (await c.call('POST', `/api/cells/${light.id}/runs`)).body.id);
  const lightMs = performance.now() - t;
  const floodDone = [];
  for (const id of floodIds) floodDone.push(await waitRunDone(a, id));
  const oneSlow = floodDone.map((r) => r.durationMs ?? 0).sort((x, y) => x - y)[10];
  rows.push([
    "another person's light run while one person has 20 heavier runs queued",
    summary([lightMs]),
    `light run ${lr.status}; each flood run ≈ ${oneSlow} ms on the runner, the flood's last finished ${((Date.parse(floodDone.at(-1).finishedAt) - Date.parse(floodDone[0].queuedAt)) / 1000).toFixed(1)} s after its first was queued`,
  ]);

  console.log(`\nHardening scenarios on ${BASE} (node ${process.version}, ${new Date().toISOString()})`);
  console.log('| scenario | p50 | p95 | max | notes |');
  console.log('|---|--:|--:|--:|---|');
  for (const [name, sum, note] of rows) console.log(`| ${name} | ${fmt(sum.p50)} | ${fmt(sum.p95)} | ${fmt(sum.max)} | ${note} |`);
  for (const id of [nb.id, heavyNb.id]) await c.call('DELETE', `/api/notebooks/${id}`);
  await a.call('DELETE', `/api/notebooks/${anb.id}`);
}

async function main() {
  if (arg('only', '') === 'hardening') return hardening();
  const c = new BenchClient(BASE);
  const health = await c.call('GET', '/api/health').catch((e) => ({ status: 0, text: e.message }));
  if (health.status !== 200) throw new Error(`no API at ${BASE} (${health.text ?? health.status}); start one with \`npm start\` or pass --url=`);
  await c.signUpFresh('load');
  await c.fetchCsrf();
  const tuple = admissibleTuple(50);
  const nb = (await c.call('POST', '/api/notebooks', { title: 'Load bench' })).body;
  const cell = (await c.call('POST', `/api/notebooks/${nb.id}/cells`, { kind: 'query', source: `admissible({${tuple.join(', ')}})` })).body;
  for (let i = 0; i < 4; i++) await c.call('POST', `/api/notebooks/${nb.id}/cells`, { kind: 'note', source: `# Note ${i}\n\nThe 50-tuple of primes above 50, shifted.` });
  const headers = { Cookie: c.cookieHeader(), 'x-csrf-token': c.csrf };
  const rows = [];

  // 0. Clients working like people (one request a second each, spread over the second).
  const people = await pacedClients({ clients: CONNECTIONS, seconds: SECONDS, path: `/api/notebooks/${nb.id}`, headers });
  rows.push([`notebook read, ${CONNECTIONS} clients × 1 read/s`, `${CONNECTIONS} clients, ${SECONDS} s`, summary(people.times), people.times.length / people.seconds, people.statuses]);
  const pressing = await pacedClients({ clients: CONNECTIONS, seconds: SECONDS, path: `/api/cells/${cell.id}/runs`, method: 'POST', headers });
  const pacedRuns = summary(pressing.times);
  rows.push([`light cell run accepted, ${CONNECTIONS} clients × 1 run/s`, `${CONNECTIONS} clients, ${SECONDS} s`, pacedRuns, pressing.times.length / pressing.seconds, pressing.statuses]);
  const finished = await runDurations(c, cell.id, pressing.from);
  rows.push([`  the same runs, queued → finished on the runner (server clock)`, `${finished.length} runs`, summary(finished), finished.length / pressing.seconds, new Map([['finished', finished.length]])]);
  // Capacity: more such clients until the accepted run's p95 passes the target.
  const capacity = [];
  for (const clients of CAPACITY_STEPS) {
    const r = await pacedClients({ clients, seconds: SECONDS, path: `/api/cells/${cell.id}/runs`, method: 'POST', headers });
    const sum = summary(r.times);
    capacity.push([clients, sum, r.times.length / r.seconds]);
    await runDurations(c, cell.id, r.from); // let the runner drain before the next step
    if (sum.p95 > TARGET_MS) break;
  }

  // 1. Reads.
  const reads = await cannon({ path: `/api/notebooks/${nb.id}`, connections: CONNECTIONS, duration: SECONDS, headers });
  const r1 = summary(reads.times);
  rows.push(['notebook read (GET, 5 cells)', `${CONNECTIONS} conn, ${SECONDS} s`, r1, reads.result.requests.average, reads.statuses]);

  // 3 before 2, so the completion latency is measured on an empty queue.
  // 3. Completed runs: each client posts a run and reads it until it has succeeded.
  const done = [];
  let next = 0;
  const failures = [];
  const t3 = Date.now();
  await Promise.all(Array.from({ length: CONNECTIONS }, async () => {
    while (next < RUNS) {
      next++;
      const t = performance.now();
      const posted = await c.call('POST', `/api/cells/${cell.id}/runs`);
      if (posted.status !== 202) { failures.push(posted.status); continue; }
      for (;;) {
        const r = await c.call('GET', `/api/runs/${posted.body.id}`);
        if (r.body?.status === 'succeeded') { done.push(performance.now() - t); break; }
        if (r.body?.status === 'failed' || r.body?.status === 'cancelled') { failures.push(r.body.status); break; }
        await new Promise((res) => setTimeout(res, 20));
      }
    }
  }));
  const s3 = (Date.now() - t3) / 1000;
  rows.push(['light cell run completed (POST → succeeded on a runner)', `${CONNECTIONS} clients, ${RUNS} runs`, summary(done), done.length / s3, new Map(failures.length ? [['failures', failures.length]] : [[202, done.length]])]);

  // 2. Accepted runs (bounded count), then the backlog drain.
  const accepts = await cannon({ path: `/api/cells/${cell.id}/runs`, method: 'POST', connections: CONNECTIONS, amount: ACCEPTS, headers });
  const r2 = summary(accepts.times);
  rows.push(['light cell run accepted (POST → 202 queued)', `${CONNECTIONS} conn, ${ACCEPTS} requests`, r2, accepts.result.requests.average, accepts.statuses]);
  // 2b. The same at a fixed offered rate with autocannon's own limiter, which sends each second's
  // requests of all connections at the same instant (a burst of RATE every second).
  const paced = await cannon({ path: `/api/cells/${cell.id}/runs`, method: 'POST', connections: CONNECTIONS, overallRate: RATE, amount: Math.min(ACCEPTS, RATE * SECONDS), headers });
  const r2b = summary(paced.times);
  rows.push([`light cell run accepted at ${RATE} req/s offered`, `${CONNECTIONS} conn, ${Math.min(ACCEPTS, RATE * SECONDS)} requests`, r2b, paced.result.requests.average, paced.statuses]);
  const queuedTotal = ACCEPTS + Math.min(ACCEPTS, RATE * SECONDS);
  const tDrain = Date.now();
  let left = Infinity;
  while (left > 0 && Date.now() - tDrain < 600_000) {
    const page = await c.call('GET', `/api/cells/${cell.id}/runs?page=1&pageSize=100`);
    left = (page.body?.items ?? page.body ?? []).filter((r) => r.status === 'queued' || r.status === 'running').length;
    if (left > 0) await new Promise((res) => setTimeout(res, 500));
  }
  const drainS = (Date.now() - tDrain) / 1000;

  console.log(`\nLoad on ${BASE} (node ${process.version}, ${new Date().toISOString()})`);
  console.log('| scenario | load | p50 | p95 | p99 | max | throughput | statuses |');
  console.log('|---|---|--:|--:|--:|--:|--:|---|');
  for (const [name, load, s, rps, st] of rows) {
    console.log(`| ${name} | ${load} | ${fmt(s.p50)} | ${fmt(s.p95)} | ${fmt(s.p99)} | ${fmt(s.max)} | ${rps.toFixed(0)}/s | ${[...st].map(([k, v]) => `${k}×${v}`).join(' ')} |`);
  }
  console.log(`\ncapacity: clients pressing *run* once a second each (spread), ${SECONDS} s per step`);
  console.log('| clients | p50 | p95 | p99 | max | throughput |');
  console.log('|--:|--:|--:|--:|--:|--:|');
  for (const [clients, sum, rps] of capacity) console.log(`| ${clients} | ${fmt(sum.p50)} | ${fmt(sum.p95)} | ${fmt(sum.p99)} | ${fmt(sum.max)} | ${rps.toFixed(0)}/s |`);
  const within = capacity.filter(([, sum]) => sum.p95 <= TARGET_MS).map(([n]) => n);
  console.log(`p95 ≤ ${TARGET_MS} ms up to ${within.length ? Math.max(...within) : 'none of the steps'} clients${within.length === capacity.length ? ' (the largest step tried)' : ''}`);
  console.log(`runner backlog of ${queuedTotal} accepted runs drained ${drainS.toFixed(1)} s after the last was accepted${left > 0 ? ' — NOT fully drained' : ''}`);
  console.log(
    `target p95 ≤ ${TARGET_MS} ms for a light cell run accepted: ${CONNECTIONS} clients × 1 run/s ${pacedRuns.p95 <= TARGET_MS ? "met" : "NOT met"} (${fmt(pacedRuns.p95)}); ` +
      `at ${RATE} req/s offered in autocannon's synchronized bursts ${r2b.p95 <= TARGET_MS ? 'met' : 'NOT met'} (${fmt(r2b.p95)}); ` +
      `${CONNECTIONS} connections back to back (saturation) ${r2.p95 <= TARGET_MS ? 'met' : 'NOT met'} (${fmt(r2.p95)})`,
  );
  await c.call('DELETE', `/api/notebooks/${nb.id}`);
}

main().catch((e) => {
  console.error(`bench:load: ${e.message}`);
  process.exitCode = 1;
});

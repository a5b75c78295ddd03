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

async function main() {
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

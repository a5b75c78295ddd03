// `npm run bench:scale [-- --ledger-to=1e10] [--level=31] [--steps-per-chunk=1e9] [--pg-port=4351]`
// Scale-out: the prime ledger up to --ledger-to (π(x), gaps, constellations, in blocks of 10^7) and
// the wheel level --level (gap histogram, streamed in chunk jobs) computed twice on a private
// PostgreSQL cluster: once by one runner process, once by two, each on a fresh database with its
// own API process. Prints both wall times, the speed-up and whether the combined results are equal.
// Each runner has one slot, so "two runners" means two processes sharing the queue.
import { spawn } from 'node:child_process';
import { chmodSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { ROOT } from '../../launcher/common.mjs';
import { cluster, ensurePostgresBinaries } from '../../launcher/postgres.mjs';
import { BenchClient } from './bench-client.mjs';

const arg = (name, fallback) => process.argv.slice(2).find((a) => a.startsWith(`--${name}=`))?.split('=')[1] ?? fallback;
const LEDGER_TO = BigInt(Number(arg('ledger-to', '1e10')));
const LEVEL = Number(arg('level', 31));
const STEPS = arg('steps-per-chunk', '1e9');
const PG_PORT = Number(arg('pg-port', 4351));
const node = process.execPath;
const children = [];

function start(name, script, env) {
  const child = spawn(node, [join(ROOT, script)], { cwd: ROOT, env, stdio: ['ignore', 'pipe', 'pipe'] });
  let log = '';
  child.stdout.on('data', (b) => (log = (log + b).slice(-4000)));
  child.stderr.on('data', (b) => (log = (log + b).slice(-4000)));
  child.on('exit', (code, signal) => {
    if (!child.stopping) console.error(`${name} exited (${code ?? signal}); last output:\n${log}`);
  });
  children.push(child);
  return child;
}

async function stop(child) {
  if (child.exitCode !== null || child.signalCode !== null) return;
  child.stopping = true;
  const gone = new Promise((r) => child.once('exit', r));
  child.kill('SIGTERM');
  await Promise.race([gone, new Promise((r) => setTimeout(r, 15_000))]);
  if (child.exitCode === null) child.kill('SIGKILL');
}

function run(script, args, env) {
  return new Promise((resolve, reject) => {
    const c = spawn(node, [join(ROOT, script), ...args], { cwd: ROOT, env, stdio: ['ignore', 'ignore', 'inherit'] });
    c.on('exit', (code) => (code === 0 ? resolve() : reject(new Error(`${script} ${args.join(' ')} exited ${code}`))));
  });
}

async function waitFor(what, probe, timeoutMs, everyMs = 1000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const v = await probe().catch(() => undefined);
    if (v !== undefined) return v;
    if (Date.now() > until) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}

/** Drops fields that name who computed what and when, keeping only the mathematics. */
function mathOnly(v) {
  if (Array.isArray(v)) return v.map(mathOnly);
  if (v && typeof v === 'object') {
    return Object.fromEntries(Object.entries(v).filter(([k]) => !/computed|runner|At$|Ms$|millis|seconds|^id$|computationId|duration/i.test(k)).map(([k, x]) => [k, mathOnly(x)]));
  }
  return v;
}

/** CPU seconds (user + system) a live process has used so far (Linux /proc; 0 elsewhere). */
function cpuSeconds(pid) {
  try {
    const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
    return (Number(fields[11]) + Number(fields[12])) / 100;
  } catch {
    return 0;
  }
}

async function computeWith(pg, runners, apiPort) {
  const db = `cribra_scale_${runners}_${Date.now().toString(36)}`;
  pg.createDatabase(db);
  const env = {
    ...process.env, DATABASE_URL: pg.url(db), PORT: String(apiPort), PUBLIC_URL: `http://127.0.0.1:${apiPort}`,
    SESSION_SECRET: 'scale-bench-'.repeat(6), SIGNUP_MODE: 'open', CRIBRA_ENV: 'development', SMTP_HOST: '127.0.0.1', SMTP_PORT: '1',
    CRIBRA_RUNNER_SLOTS: '1', CRIBRA_LEVEL_STEPS_PER_CHUNK: STEPS, CRIBRA_RUNNER_POLL_MS: '200',
  };
  delete env.WEB_DIST;
  await run('apps/api/dist/database/migrate.js', ['up'], env);
  const api = start(`api (${runners} runner)`, 'apps/api/dist/main.js', env);
  const c = new BenchClient(`http://127.0.0.1:${apiPort}`);
  await waitFor('the API', async () => ((await c.call('GET', '/api/health')).status === 200 ? true : undefined), 60_000, 300);
  await c.signUpFresh('scale');

  // Queue both computations first, then start the runners, so the clock measures only their work.
  const ledger = await c.call('POST', '/api/ledger/computations', { from: '0', to: String(LEDGER_TO) });
  const level = await c.call('POST', `/api/levels/${LEVEL}/computations`);
  for (const r of [ledger, level]) if (r.status !== 202) throw new Error(`queueing failed: ${r.status} ${r.text.slice(0, 300)}`);
  const started = Date.now();
  const procs = Array.from({ length: runners }, (_, i) => start(`runner ${i + 1}/${runners}`, 'apps/runner/dist/main.js', { ...env, CRIBRA_RUNNER_ID: `scale-${runners}-${i + 1}` }));
  const finished = {};
  for (const [name, id] of [['ledger', ledger.body.id], ['level', level.body.id]]) {
    const done = await waitFor(`${name} computation`, async () => {
      const v = (await c.call('GET', `/api/computations/${id}`)).body;
      if (v?.status === 'failed') throw new Error(`${name} computation failed: ${JSON.stringify(v.error ?? v)}`);
      return v?.status === 'succeeded' ? v : undefined;
    }, 6 * 3600_000, 1000);
    finished[name] = { seconds: (Date.now() - started) / 1000, chunks: done.chunksTotal };
  }
  const seconds = (Date.now() - started) / 1000;
  const range = (await c.call('GET', `/api/ledger/range?from=0&to=${LEDGER_TO}`)).body;
  const wheel = (await c.call('GET', `/api/levels/${LEVEL}`)).body;
  const cpu = procs.map((p) => cpuSeconds(p.pid));
  const load = loadavg()[1];
  for (const p of procs) await stop(p);
  await stop(api);
  return { seconds, finished, range, wheel, cpu, load };
}

async function main() {
  const dir = mkdtempSync(join(tmpdir(), 'cribra-scale-'));
  chmodSync(dir, 0o755);
  const pg = cluster({ bin: ensurePostgresBinaries(), dataDir: join(dir, 'pg'), port: PG_PORT });
  try {
    pg.init();
    await pg.start();
    console.error(`bench:scale: ledger to ${LEDGER_TO}, level ${LEVEL}#, chunks of ${STEPS} steps — one runner first…`);
    const one = await computeWith(pg, 1, PG_PORT + 1);
    console.error(`bench:scale: one runner ${one.seconds.toFixed(1)} s; now two runners…`);
    const two = await computeWith(pg, 2, PG_PORT + 2);
    const same = JSON.stringify(mathOnly([one.range, one.wheel])) === JSON.stringify(mathOnly([two.range, two.wheel]));
    console.log(`\nScale-out (node ${process.version}, ${new Date().toISOString()})`);
    console.log('| work | one runner | two runners | speed-up |');
    console.log('|---|--:|--:|--:|');
    console.log(`| ledger 0..${LEDGER_TO} (${one.finished.ledger.chunks} blocks) + level ${LEVEL}# (${one.finished.level.chunks} chunks), both queued at once | ${one.seconds.toFixed(1)} s | ${two.seconds.toFixed(1)} s | ${(one.seconds / two.seconds).toFixed(2)}× |`);
    const cpuLine = (r) => `${r.cpu.map((x) => x.toFixed(1)).join(' + ')} s CPU → ${(r.cpu.reduce((a, b) => a + b, 0) / r.seconds).toFixed(2)} cores busy on average, load average ${r.load.toFixed(1)}`;
    console.log(`one runner: ${cpuLine(one)}; two runners: ${cpuLine(two)}`);
    console.log('(on a machine shared with other work the speed-up follows the cores the runners actually got, shown as "cores busy")');
    console.log(`π(${LEDGER_TO}) = ${one.range.primeCount}; twins ${one.range.constellations?.twin}; largest gap ${JSON.stringify(one.range.largestGap)}; level ${LEVEL}# largest gap ${one.wheel.largestGap}`);
    console.log(`combined results of one and two runners equal: ${same ? 'yes' : 'NO'}`);
    if (!same) process.exitCode = 1;
  } finally {
    for (const c of children) await stop(c);
    pg.stop();
    rmSync(dir, { recursive: true, force: true });
  }
}

main().catch((e) => {
  console.error(`bench:scale: ${e.stack ?? e.message}`);
  process.exitCode = 1;
});

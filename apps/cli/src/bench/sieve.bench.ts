// Sieve and Hardy–Littlewood benchmarks (figures, not tests): called by the bench runner; prints nothing itself.
import { execFileSync } from 'node:child_process';
import { sievePrimeBlock, singularSeries } from '@cribra/engine';
import { sieveKernel, sievePrimeBlockParallel } from '@cribra/engine/node';

/** Wall time, and CPU time of the whole process (all threads: on a busy machine it shows the work). */
async function time<T>(fn: () => T | Promise<T>): Promise<{ value: T; seconds: number; cpu: number }> {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const value = await fn();
  const c = process.cpuUsage(c0);
  return { value, seconds: (performance.now() - t0) / 1000, cpu: (c.user + c.system) / 1e6 };
}

const s = (x: number) => `${x.toFixed(x < 10 ? 2 : 1)} s`;

/** The reference C sieve on one thread, when it is installed (Debian package `primesieve`). */
function referenceSeconds(bound: string): number | null {
  try {
    const out = execFileSync('primesieve', [bound, '-c1', '-c2', '-t1', '--no-status'], { encoding: 'utf8' });
    const m = /Seconds:\s*([\d.]+)/.exec(out);
    return m ? Number(m[1]) : null;
  } catch {
    return null;
  }
}

/** Rounds of each measurement: the machine is shared and noisy, so the best of them is reported (and the median). */
const ROUNDS = 5;

interface Series {
  best: number;
  median: number;
}

function series(values: number[]): Series {
  const sorted = [...values].sort((x, y) => x - y);
  return { best: sorted[0]!, median: sorted[Math.floor(sorted.length / 2)]! };
}

const bm = (x: Series) => `best ${s(x.best)}, median ${s(x.median)}`;

/**
 * π and twin-prime counts to 10^9 and 10^10 in the calling thread (WebAssembly kernel and
 * JavaScript sieve) and on 1 and 2 worker threads (kernel),
 * beside the reference C sieve on one thread when present: each measured ROUNDS times, interleaved
 * (so that a noisy spell hits all of them alike), best and median reported. The workers are started
 * and warmed up once before (they are kept between calls, as the calling thread's code is warm);
 * S(H) of a 6-tuple.
 */
export async function benchSieve(): Promise<Array<{ name: string; figure: string }>> {
  const out: Array<{ name: string; figure: string }> = [];
  const twins = { patterns: [[0, 2]] };
  const kernel = sieveKernel(); // the calling thread's WebAssembly kernel (the workers have their own)
  sievePrimeBlock(0, 10_000_000, twins); // warm-up (JIT, sieving primes, patterns)
  sievePrimeBlock(0, 10_000_000, { ...twins, kernel });
  await sievePrimeBlockParallel(0, 200_000_000, { ...twins, workers: 2, blocks: 8 }); // starts and warms both workers
  for (const [label, bound] of [['10^9', '1e9'], ['10^10', '1e10']] as const) {
    const thread: number[] = [];
    const threadJs: number[] = [];
    const w1: number[] = [];
    const w2: number[] = [];
    const ref: number[] = [];
    let counts = '';
    for (let round = 0; round < ROUNDS; round++) {
      const one = await time(() => sievePrimeBlock(0, bound, { ...twins, kernel }));
      counts = `π = ${one.value.primeCount}, twins = ${one.value.patterns[0]!.count}`;
      thread.push(one.seconds);
      const js = await time(() => sievePrimeBlock(0, bound, twins));
      if (js.value.primeCount !== one.value.primeCount) throw new Error('the JavaScript sieve disagrees with the kernel');
      threadJs.push(js.seconds);
      for (const [workers, into] of [[1, w1], [2, w2]] as const) {
        const r = await time(() => sievePrimeBlockParallel(0, bound, { ...twins, workers }));
        if (r.value.primeCount !== one.value.primeCount) throw new Error(`${workers} workers disagree with the calling thread`);
        into.push(r.seconds);
      }
      const c = referenceSeconds(bound);
      if (c !== null) ref.push(c);
    }
    const [t, a, b, j] = [series(thread), series(w1), series(w2), series(threadJs)];
    out.push({ name: `π + twins to ${label}, calling thread, WebAssembly kernel (${counts})`, figure: bm(t) });
    out.push({ name: `π + twins to ${label}, calling thread, JavaScript sieve (best vs best: ×${(j.best / t.best).toFixed(2)} the kernel)`, figure: bm(j) });
    out.push({ name: `π + twins to ${label}, 1 worker`, figure: bm(a) });
    out.push({ name: `π + twins to ${label}, 2 workers (best vs best: ×${(a.best / b.best).toFixed(2)} faster than 1 worker)`, figure: bm(b) });
    if (ref.length === 0) out.push({ name: `π + twins to ${label}, reference C sieve, 1 thread`, figure: 'not installed' });
    else {
      const c = series(ref);
      out.push({
        name: `π + twins to ${label}, reference C sieve, 1 thread (best vs best: ours on 1 worker ×${(a.best / c.best).toFixed(2)}, calling thread ×${(t.best / c.best).toFixed(2)})`,
        figure: bm(c),
      });
    }
  }
  const H = [0, 4, 6, 10, 12, 16];
  const sh = await time(() => singularSeries(H));
  out.push({ name: `S(H) of the 6-tuple {${H.join(',')}} = ${sh.value.decimal}`, figure: `${(sh.seconds * 1000).toFixed(1)} ms` });
  return out;
}

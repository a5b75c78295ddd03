// Sieve and Hardy–Littlewood benchmarks (figures, not tests): called by the bench runner; prints nothing itself.
import { execFileSync } from 'node:child_process';
import { sievePrimeBlock, singularSeries } from '@cribra/engine';
import { sievePrimeBlockParallel } from '@cribra/engine/node';

/** Wall time, and CPU time of the whole process (all threads: on a busy machine it shows the work). */
async function time<T>(fn: () => T | Promise<T>): Promise<{ value: T; seconds: number; cpu: number }> {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const value = await fn();
  const c = process.cpuUsage(c0);
  return { value, seconds: (performance.now() - t0) / 1000, cpu: (c.user + c.system) / 1e6 };
}

const s = (x: number) => `${x.toFixed(x < 10 ? 2 : 1)} s`;
const wallCpu = (t: { seconds: number; cpu: number }) => `${s(t.seconds)} (CPU ${s(t.cpu)})`;

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

/**
 * π and twin-prime counts to 10^9 and 10^10 on 1 and 2 worker threads (and in the calling thread),
 * beside the reference C sieve on one thread when present; S(H) of a 6-tuple.
 */
export async function benchSieve(): Promise<Array<{ name: string; figure: string }>> {
  const out: Array<{ name: string; figure: string }> = [];
  sievePrimeBlock(0, 10_000_000, { patterns: [[0, 2]] }); // warm-up (JIT, sieving primes, patterns)
  for (const [label, bound] of [['10^9', '1e9'], ['10^10', '1e10']] as const) {
    const one = await time(() => sievePrimeBlock(0, bound, { patterns: [[0, 2]] }));
    const counts = `π = ${one.value.primeCount}, twins = ${one.value.patterns[0]!.count}`;
    out.push({ name: `π + twins to ${label}, calling thread (${counts})`, figure: wallCpu(one) });
    let w1 = 0;
    for (const workers of [1, 2]) {
      const r = await time(() => sievePrimeBlockParallel(0, bound, { workers, patterns: [[0, 2]] }));
      if (workers === 1) w1 = r.seconds;
      const speedup = workers === 2 ? ` (×${(w1 / r.seconds).toFixed(2)} vs 1 worker)` : '';
      out.push({ name: `π + twins to ${label}, ${workers} worker${workers > 1 ? 's' : ''}${speedup}`, figure: wallCpu(r) });
    }
    const ref = referenceSeconds(bound);
    out.push({
      name: `π + twins to ${label}, reference C sieve, 1 thread`,
      figure: ref === null ? 'not installed' : `${s(ref)} (ours, calling thread: ×${(one.seconds / ref).toFixed(2)})`,
    });
  }
  const H = [0, 4, 6, 10, 12, 16];
  const sh = await time(() => singularSeries(H));
  out.push({ name: `S(H) of the 6-tuple {${H.join(',')}} = ${sh.value.decimal}`, figure: `${(sh.seconds * 1000).toFixed(1)} ms` });
  return out;
}

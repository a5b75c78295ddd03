// Narrow-tuple benchmarks (figures, not tests): called by the bench runner; prints nothing itself.
import { greedyGreedySieve, minimalDiameter, narrowAdmissibility, type DiameterSearchStats } from '@cribra/engine';

// Wall time and this process's CPU time (all single-threaded here): on a shared machine the CPU
// figure is the one to compare.
async function time<T>(fn: () => T | Promise<T>): Promise<{ value: T; seconds: number; cpu: number }> {
  const t0 = performance.now();
  const c0 = process.cpuUsage();
  const value = await fn();
  const c = process.cpuUsage(c0);
  return { value, seconds: (performance.now() - t0) / 1000, cpu: (c.user + c.system) / 1e6 };
}

const sec = (x: number) => (x < 0.01 ? `${(x * 1000).toFixed(2)} ms` : `${x.toFixed(x < 10 ? 2 : 1)} s`);
const s = (t: { seconds: number; cpu: number }) => `${sec(t.seconds)} (cpu ${sec(t.cpu)})`;

/**
 * H(20), H(25), H(30) and H(50) by the exhaustive search (nodes visited), the greedy-greedy
 * 34 429-tuple of the Polymath8 records (sieve and admissibility separately).
 */
export async function benchNarrow(): Promise<Array<{ name: string; figure: string }>> {
  const out: Array<{ name: string; figure: string }> = [];
  for (const k of [20, 25, 30, 50]) {
    const stats: DiameterSearchStats = { nodes: 0 };
    const r = await time(() => minimalDiameter(k, stats));
    out.push({ name: `H(${k}) = ${r.value.diameter}, exhaustive search (${stats.nodes} nodes)`, figure: s(r) });
  }
  const gg = await time(() => greedyGreedySieve({ from: -185662, to: 202456, fixedBound: 137 }));
  out.push({
    name: `greedy-greedy [−185662, 202456]: ${gg.value.k} survivors, diameter ${gg.value.diameter} (sieve + witness)`,
    figure: s(gg),
  });
  const survivors = gg.value.tuple;
  const adm = await time(() => narrowAdmissibility(survivors));
  out.push({
    name: `narrow-module admissibility of that ${survivors.length}-tuple (${adm.value.admissible ? 'admissible' : 'NOT admissible'})`,
    figure: s(adm),
  });
  return out;
}

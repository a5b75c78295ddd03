// Narrow-tuple benchmarks (figures, not tests): called by the bench runner; prints nothing itself.
import { greedyGreedySieve, minimalDiameter, narrowAdmissibility, narrowTuple, type DiameterSearchStats } from '@cribra/engine';
import { narrowSearchParallel } from '@cribra/engine/node';

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

// Published diameters the search is measured against (Polymath8a, "New equidistribution estimates
// of Zhang type", 2014: H = 4 680 for k0 = 632 and H = 14 994 for k0 = 1 783; the greedy-greedy
// 34 429-tuple of diameter 388 118 of the Polymath8 narrow-tuple records, 2013).
const SEARCH_TARGETS: ReadonlyArray<{ k: number; seconds: number; published?: number }> = [
  { k: 632, seconds: 60, published: 4680 },
  { k: 1783, seconds: 60, published: 14994 },
  { k: 5000, seconds: 60 },
  { k: 34429, seconds: 300, published: 388118 },
];

/**
 * The local search of `cribra narrowest --search` at the budgets, on 2 workers and on 1,
 * against narrowTuple(k) and the published diameters. CRIBRA_BENCH_SEARCH_SCALE (default 1)
 * scales every budget (0.1 for a quick look). Takes about 16 minutes at scale 1.
 */
export async function benchNarrowSearch(): Promise<Array<{ name: string; figure: string }>> {
  const scale = Number(process.env.CRIBRA_BENCH_SEARCH_SCALE ?? '1');
  const out: Array<{ name: string; figure: string }> = [];
  for (const workers of [2, 1]) {
    for (const { k, seconds, published } of SEARCH_TARGETS) {
      const budget = Math.max(1, Math.round(seconds * scale));
      const base = await time(() => narrowTuple(k));
      const r = await time(() => narrowSearchParallel(k, { seconds: budget, workers }));
      const ok = narrowAdmissibility(r.value.tuple).admissible ? 'admissible' : 'NOT admissible';
      const vs = published ? `, ${(((r.value.diameter - published) / published) * 100).toFixed(2)} % from ${published}` : '';
      out.push({
        name: `k = ${k}, ${budget} s on ${workers} worker(s): diameter ${r.value.diameter} (narrowest ${base.value.diameter}${vs}; ${ok})`,
        figure: `${sec(r.seconds)} wall`,
      });
    }
  }
  return out;
}

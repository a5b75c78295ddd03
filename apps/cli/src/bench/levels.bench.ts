// Deep wheel levels (figures, not tests): the split route against the closed-form counts, in process
// and as whole `cribra wheel` processes. Prints nothing itself.
import { execFileSync } from 'node:child_process';
import { join } from 'node:path';
import {
  clearClosedFormCache, clearSplitWindowCache, clearWheelCache, defaultSplitBase, gapCount, histogramByCounts, histogramIdentities, histogramMaxGap, runSplitChunk,
  splitHistogramsFromResult, wheelGaps, type GapHistogram,
} from '@cribra/engine';
import { splitHistogramsParallel } from '@cribra/engine/node';

interface Timed<T> {
  value: T;
  wall: number;
  cpu: number;
}

async function timed<T>(fn: () => T | Promise<T>): Promise<Timed<T>> {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const value = await fn();
  const c = process.cpuUsage(c0);
  return { value, wall: (performance.now() - t0) / 1000, cpu: (c.user + c.system) / 1e6 };
}

const s = (x: number) => `${x.toFixed(x < 10 ? 2 : 1)} s`;
const both = (t: Timed<unknown>) => `${s(t.wall)} (cpu ${s(t.cpu)})`;
const same = (a: GapHistogram, b: GapHistogram) => a.size === b.size && [...a].every(([g, v]) => b.get(g) === v);

/** One level by the split route in this thread, from a cold base cycle. */
function splitOnce(p: number, base = defaultSplitBase(p)) {
  clearWheelCache();
  clearSplitWindowCache();
  const gaps = wheelGaps(base);
  const r = runSplitChunk({ base, levels: [p], from: 0, to: gaps.length }, gaps);
  return { histogram: splitHistogramsFromResult(r).get(p)!, exact: r.exactWindows[0]!, distinct: r.distinctWindows[0]! };
}

/**
 * 41#, 43#, 47# by the split route (one thread, each from its default base and from the other one;
 * all levels 29 … 47 in one pass over 23#; 47# on 2 workers; `cribra wheel --level 47` as a whole
 * process). The closed-form route beside it: {@link benchClosedForms}.
 */
export async function benchLevels(): Promise<Array<{ name: string; figure: string }>> {
  const rows: Array<{ name: string; figure: string }> = [];
  // each row also goes to stderr at once: the closed-form rows take minutes
  const out = { push: (r: { name: string; figure: string }) => (rows.push(r), process.stderr.write(`  ${r.name}: ${r.figure}\n`)) };
  const split = new Map<number, GapHistogram>();
  for (const [p, bases] of [[41, [19, 23]], [43, [19, 23]], [47, [23, 19]]] as const) {
    for (const base of bases) {
      const t = await timed(() => splitOnce(p, base));
      const h = t.value.histogram;
      if (!split.has(p)) split.set(p, h);
      const agree = same(h, split.get(p)!) ? '' : ', DIFFERENT from the other base';
      const ok = histogramIdentities(p, h).holds ? 'identities hold' : 'IDENTITIES FAIL';
      out.push({
        name: `${p}# split route over ${base}#, 1 thread (j = ${histogramMaxGap(h)}; ${t.value.exact} windows counted exactly, ${t.value.distinct} distinct; ${ok}${agree})`,
        figure: both(t),
      });
    }
  }
  clearWheelCache();
  clearSplitWindowCache();
  const all = await timed(() => {
    const gaps = wheelGaps(23);
    return splitHistogramsFromResult(runSplitChunk({ base: 23, levels: [29, 31, 37, 41, 43, 47], from: 0, to: gaps.length }, gaps));
  });
  const allSame = [41, 43, 47].every((p) => same(all.value.get(p)!, split.get(p)!));
  out.push({ name: `29# … 47# (six levels) in one pass over 23#, 1 thread (${allSame ? 'equal' : 'DIFFERENT'} to the single levels)`, figure: both(all) });
  const par = await timed(() => splitHistogramsParallel([47], { workers: 2, base: 23 }));
  out.push({ name: `47# split route over 23#, 2 workers (target: full 47# histogram ≤ 600 s; ${same(par.value.histograms.get(47)!, split.get(47)!) ? 'equal' : 'DIFFERENT'})`, figure: s(par.wall) });
  const one = await timed(() => {
    const bin = join(__dirname, '..', 'main.js');
    return JSON.parse(execFileSync(process.execPath, [bin, 'wheel', '--level', '47', '--workers', '2', '--json'], { encoding: 'utf8' })) as { maxGap: number; route: string };
  });
  out.push({ name: `whole process: cribra wheel --level 47 --workers 2 (route ${one.value.route}, largest gap ${one.value.maxGap})`, figure: s(one.wall) });
  return rows;
}

/**
 * The closed-form route at 41# … 47# (minutes): one count at 47# (gaps 90 and 100) and whole
 * histograms by the inclusion–exclusion counts alone, each compared with the split route.
 */
export async function benchClosedForms(): Promise<Array<{ name: string; figure: string }>> {
  const rows: Array<{ name: string; figure: string }> = [];
  const out = { push: (r: { name: string; figure: string }) => (rows.push(r), process.stderr.write(`  ${r.name}: ${r.figure}\n`)) };
  const split = new Map([41, 43, 47].map((p) => [p, splitOnce(p).histogram]));
  // the closed-form route: one count at 47# (gap 90: 13 primes in the inclusion–exclusion) …
  // every row from a cold cache of closed forms (a form serves every level from its validFrom on)
  clearClosedFormCache();
  const c90 = await timed(() => gapCount(90, 47));
  out.push({ name: `one closed-form count at 47#: gap 90 (${c90.value === split.get(47)!.get(90) ? 'equals' : 'DIFFERS FROM'} the split route)`, figure: both(c90) });
  clearClosedFormCache();
  const c100 = await timed(() => gapCount(100, 47));
  out.push({ name: `one closed-form count at 47#: gap 100, 14 primes (${c100.value === split.get(47)!.get(100) ? 'equals' : 'DIFFERS FROM'} the split route)`, figure: both(c100) });
  // … and whole histograms by the closed forms alone (independent of the split route)
  for (const p of [41, 43, 47]) {
    clearClosedFormCache();
    const t = await timed(() => histogramByCounts(p));
    out.push({ name: `${p}# histogram by closed-form counts alone, 1 thread (${same(t.value, split.get(p)!) ? 'equal to' : 'DIFFERENT from'} the split route)`, figure: both(t) });
  }
  return rows;
}

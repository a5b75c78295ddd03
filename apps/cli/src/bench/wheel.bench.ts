// Wheel benchmarks (figures, not tests): called by the bench runner; prints nothing itself.
import {
  admissibility, clearWheelCache, cycleHistogramAndPairSums, gapHistogram, histogramByCounts, planWheelChunks,
  greedyGreedySieve, patternCount, patternsFromDense, streamLevel, wheelGaps,
} from '@cribra/engine';
import { gapHistogramParallel, runWheelChunksParallel } from '@cribra/engine/node';

async function time<T>(fn: () => T | Promise<T>): Promise<{ value: T; seconds: number }> {
  const t0 = performance.now();
  const value = await fn();
  return { value, seconds: (performance.now() - t0) / 1000 };
}

const s = (x: number) => `${x.toFixed(x < 10 ? 2 : 1)} s`;

/**
 * Wheel figures: 23# enumeration, 29#/31#/37# histograms (recursions and the 2-worker driver),
 * the 37# histogram by inclusion–exclusion alone, an estimate of streaming all 3.07·10^10 members
 * of 31# with pair tallies on 2 workers, and admissibility of a 34 429-tuple.
 */
export async function benchWheel(): Promise<Array<{ name: string; figure: string }>> {
  const out: Array<{ name: string; figure: string }> = [];
  clearWheelCache();
  wheelGaps(19);
  const e23 = await time(() => wheelGaps(23));
  out.push({ name: '23# gap cycle (36 495 360 gaps, from 19#)', figure: s(e23.seconds) });
  const h23 = await time(() => cycleHistogramAndPairSums(e23.value));
  out.push({ name: '23# histogram + pair sums (one scan)', figure: s(h23.seconds) });
  const h29 = await time(() => gapHistogram(29));
  out.push({ name: '29# histogram (recursion over one scan of 23#)', figure: s(h29.seconds) });
  const h31 = await time(() => gapHistogram(31));
  out.push({ name: '31# histogram (recursion; pair tally from 23# quadruples)', figure: s(h31.seconds) });
  const h37 = await time(() => gapHistogramParallel(37, { workers: 2 }));
  const max37 = Math.max(...h37.value.keys());
  out.push({ name: `37# histogram, 2 workers (streams 29# quadruples; max gap ${max37})`, figure: s(h37.seconds) });
  const c37 = await time(() => histogramByCounts(37));
  const same = [...c37.value].every(([g, v]) => h37.value.get(g) === v) && c37.value.size === h37.value.size;
  out.push({ name: `37# histogram by inclusion–exclusion (${same ? 'equal' : 'DIFFERENT'})`, figure: s(c37.seconds) });
  const c41 = await time(() => histogramByCounts(41));
  out.push({ name: `41# histogram by inclusion–exclusion (max gap ${Math.max(...c41.value.keys())})`, figure: s(c41.seconds) });
  // streaming 31# itself with pair tallies: measure 16 of 899 copies on 2 workers, extrapolate
  const specs = planWheelChunks(23, 31, 899, 2).slice(0, 16);
  const part = await time(() => runWheelChunksParallel(specs, { workers: 2 }));
  out.push({ name: '31# full stream with pair tallies, 2 workers (estimate from 16/899 copies)', figure: s((part.seconds * 899) / 16) });
  // slow check outside CI: the 29# cycle streamed (enumeration, with pair tallies) against the
  // closed forms — every gap, and every consecutive pair of span ≤ 60
  const e29 = await time(() => streamLevel(29, 2, 4e9));
  const forms29 = histogramByCounts(29);
  let agree = true;
  for (let h = 0; h < e29.value.histogram.length; h++) if (BigInt(e29.value.histogram[h]!) !== (forms29.get(2 * h) ?? 0n)) agree = false;
  const pairs = patternsFromDense(e29.value.patterns!, 2, e29.value.radix + 1, e29.value.radix);
  let checked = 0;
  for (let a = 2; a <= 58; a += 2) {
    for (let b = 2; a + b <= 60; b += 2) {
      if (patternCount([a, b], 29) !== (pairs.get(`${a},${b}`) ?? 0n)) agree = false;
      checked++;
    }
  }
  out.push({ name: `29# enumeration streamed from 23# (${agree ? 'equals' : 'DIFFERS FROM'} the closed forms: all gaps, ${checked} pairs)`, figure: s(e29.seconds) });
  // The 34 429-tuple of the Polymath8 narrow-tuple records (2013): greedy-greedy sieving of [−185662, 202456].
  const polymath = greedyGreedySieve({ from: -185662, to: 202456, fixedBound: 137 }).tuple;
  const adm = await time(() => admissibility(polymath));
  out.push({
    name: `admissibility of the Polymath8 ${polymath.length}-tuple (diameter ${adm.value.diameter}, ${adm.value.admissible ? 'admissible' : 'not admissible'})`,
    figure: s(adm.seconds),
  });
  return out;
}

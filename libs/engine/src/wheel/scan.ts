import { inputError } from '../errors';
import { histogramFromDense, patternsFromDense, type GapHistogram, type PatternTally } from './tally';

/** What a scan of a whole gap cycle returns. */
export interface CycleScan {
  readonly maxGap: number;
  readonly histogram: GapHistogram;
  /** gap → least member m of the cycle (starting at 1) such that the next member is m + gap. */
  readonly firstPosition: ReadonlyMap<number, number>;
  /** Tallies of consecutive gap patterns of length 2, 3, 4 (cyclic: every member starts one). */
  readonly patterns: ReadonlyMap<number, PatternTally>;
}

/**
 * Scans a gap cycle (one period; patterns wrap around): histogram, largest gap, first position of
 * each gap, and tallies of consecutive patterns of the requested lengths (each in 2 … 4).
 * @throws EngineError(input) for an empty cycle, an odd gap (other than a cycle of 1s) or a length outside 2 … 4.
 */
export function scanGapCycle(gaps: Uint8Array, patternLengths: readonly number[] = [2, 3, 4]): CycleScan {
  const n = gaps.length;
  if (n === 0) throw inputError('empty gap cycle');
  for (const L of patternLengths) if (!(L >= 2 && L <= 4)) throw inputError(`pattern length ${L} is not in 2 … 4`);
  let max = 0;
  for (let i = 0; i < n; i++) if (gaps[i]! > max) max = gaps[i]!;
  const K = (max >> 1) + 1;
  const hist = new Float64Array(K);
  const first = new Float64Array(K).fill(-1);
  let pos = 1;
  for (let i = 0; i < n; i++) {
    const g = gaps[i]!;
    if (g & 1 && g !== 1) throw inputError(`odd gap ${g} in a wheel cycle`);
    const h = g >> 1;
    if (hist[h] === 0) first[h] = pos;
    hist[h]!++;
    pos += g;
  }
  const firstPosition = new Map<number, number>();
  for (let h = 0; h < K; h++) if (first[h]! >= 0) firstPosition.set(2 * h, first[h]!);
  const patterns = new Map<number, PatternTally>();
  for (const L of patternLengths) {
    const dense = n < 2 ** 32 ? new Uint32Array(K ** L) : new Float64Array(K ** L);
    const mod = K ** (L - 1);
    // window index over half-gaps: drop the leading digit by subtraction, append the next gap
    let idx = 0;
    for (let i = 0; i < L; i++) idx = idx * K + (gaps[i % n]! >> 1);
    dense[idx]!++;
    const bulk = Math.max(1, n - (L - 1));
    for (let i = 1; i < bulk; i++) {
      idx = (idx - (gaps[i - 1]! >> 1) * mod) * K + (gaps[i + L - 1]! >> 1);
      dense[idx]!++;
    }
    for (let i = bulk; i < n; i++) {
      idx = (idx - (gaps[i - 1]! >> 1) * mod) * K + (gaps[(i + L - 1) % n]! >> 1);
      dense[idx]!++;
    }
    patterns.set(L, patternsFromDense(dense, L, K));
  }
  return { maxGap: max, histogram: histogramFromDense(hist), firstPosition, patterns };
}

/**
 * Fast pass over a gap cycle: dense histogram (index g/2) and dense pair sums T2 (index (a+b)/2,
 * a and b consecutive gaps, cyclic). Used by the histogram recursion.
 */
export function cycleHistogramAndPairSums(gaps: Uint8Array): { histogram: GapHistogram; pairSums: GapHistogram } {
  const n = gaps.length;
  if (n === 0) throw inputError('empty gap cycle');
  // integer tallies: one period of a level ≤ 23 has fewer than 2^32 gaps
  const hist = n < 2 ** 32 ? new Uint32Array(128) : new Float64Array(128);
  const t2 = n < 2 ** 32 ? new Uint32Array(256) : new Float64Array(256);
  let prev = gaps[n - 1]!;
  for (let i = 0; i < n; i++) {
    const g = gaps[i]!;
    hist[g >> 1]!++;
    t2[(prev + g) >> 1]!++;
    prev = g;
  }
  return { histogram: histogramFromDense(hist), pairSums: histogramFromDense(t2) };
}

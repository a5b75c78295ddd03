import { MAX_MEMORY_LEVEL, wheelGaps } from '../wheel/level-gaps';
import { checkLevel, primorial, primorialTotient } from '../wheel/primorial';
import type { GapHistogram } from '../wheel/tally';
import { checkPattern, gapCount } from './closed-form';

/**
 * Occurrences of a consecutive gap pattern in one period of level p ≤ 23, by walking the gap cycle
 * (cyclically; an independent path to {@link patternCount}).
 * @throws EngineError(input) for a bad pattern or level; EngineError(limit) when p > 23.
 */
export function enumeratedPatternCount(gaps: readonly number[], p: number): bigint {
  checkPattern(gaps);
  checkLevel(p, MAX_MEMORY_LEVEL);
  const cycle = wheelGaps(p);
  const n = cycle.length;
  const m = gaps.length;
  let count = 0;
  outer: for (let i = 0; i < n; i++) {
    if (cycle[i] !== gaps[0]) continue;
    for (let k = 1; k < m; k++) if (cycle[(i + k) % n] !== gaps[k]) continue outer;
    count++;
  }
  return BigInt(count);
}

/**
 * Gap histogram of level p from the closed forms / inclusion–exclusion alone (no enumeration):
 * counts n_g for g = 2, 4, … until Σ n_g = φ(p#) and Σ g·n_g = p# (both checked). An independent
 * path to the wheel histograms; practical while the largest gap stays ≤ ~70 (levels ≤ 37).
 * @throws EngineError(limit) when the gaps run past the inclusion–exclusion span limit (120).
 */
export function histogramByCounts(p: number): GapHistogram {
  checkLevel(p);
  const phi = primorialTotient(p);
  const mod = primorial(p);
  const out = new Map<number, bigint>();
  let members = 0n;
  let length = 0n;
  for (let g = 2; members < phi; g += 2) {
    const n = gapCount(g, p);
    if (n > 0n) out.set(g, n);
    members += n;
    length += BigInt(g) * n;
  }
  if (members !== phi || length !== mod) throw new Error(`internal: level ${p} counts sum to ${members}, ${length}`);
  return out;
}

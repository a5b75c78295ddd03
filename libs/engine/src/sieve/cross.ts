// Crossing off the multiples of the sieving primes below LARGE_PRIME_BOUND: eight progressions each.
import { CROSSING_PRIMES_MAX, SEGMENT_BUFFER } from './layout';
import { CLASS_STEP, firstCofactor, PRODUCT_MASK, PRODUCT_RESIDUE } from './wheel30';

// The segment and the crossing state as module constants (see SEGMENT_BUFFER: why not parameters;
// for the state arrays it spares the per-prime loads of their storage and length). Crossing prime i
// (the i-th sieving prime above LAST_PATTERN_PRIME) is PRIMES[i]; its progression in residue class c is at byte
// NEXT[8i + c] with mask MASKS[8i + c].
const BUF = new Uint8Array(SEGMENT_BUFFER);
const PRIMES = new Int32Array(CROSSING_PRIMES_MAX);
const NEXT = new Int32Array(8 * CROSSING_PRIMES_MAX);
const MASKS = new Uint8Array(8 * CROSSING_PRIMES_MAX);

/**
 * Crosses off in the segment buffer, for the crossing primes i0 ≤ i < i1, every multiple whose byte
 * lies before `end`; each progression is left at its first byte ≥ end, minus `shift` (the segment
 * length when the segment is finished, so that positions become relative to the next segment).
 */
export function crossRange(i0: number, i1: number, end: number, shift: number): void {
  const buf = BUF;
  const next = NEXT;
  const masks = MASKS;
  for (let i = i0; i < i1; i++) {
    const p = PRIMES[i]!;
    const o = i << 3;
    let j0 = next[o]!, j1 = next[(o + 1) | 0]!, j2 = next[(o + 2) | 0]!, j3 = next[(o + 3) | 0]!;
    let j4 = next[(o + 4) | 0]!, j5 = next[(o + 5) | 0]!, j6 = next[(o + 6) | 0]!, j7 = next[(o + 7) | 0]!;
    const m0 = masks[o]!, m1 = masks[(o + 1) | 0]!, m2 = masks[(o + 2) | 0]!, m3 = masks[(o + 3) | 0]!;
    const m4 = masks[(o + 4) | 0]!, m5 = masks[(o + 5) | 0]!, m6 = masks[(o + 6) | 0]!, m7 = masks[(o + 7) | 0]!;
    // The eight progressions keep fixed distances: step one index and address the rest from it.
    const d1 = j1 - j0, d2 = j2 - j0, d3 = j3 - j0, d4 = j4 - j0, d5 = j5 - j0, d6 = j6 - j0, d7 = j7 - j0;
    // stop = end − max(0, d1 … d7), without branches (which one is largest is unpredictable).
    let mx = d1 & ~(d1 >> 31);
    let u = mx - d2; mx -= u & (u >> 31);
    u = mx - d3; mx -= u & (u >> 31);
    u = mx - d4; mx -= u & (u >> 31);
    u = mx - d5; mx -= u & (u >> 31);
    u = mx - d6; mx -= u & (u >> 31);
    u = mx - d7; mx -= u & (u >> 31);
    const stop = end - mx;
    let J = j0;
    // Two periods per turn while they fit (half the loop overhead), then at most one more. `| 0`
    // tells V8 that an index sum cannot overflow, which spares a check per crossing (cachegrind:
    // 8 % fewer instructions).
    const stop2 = stop - p;
    while (J < stop2) {
      const K = J + p;
      buf[J] &= m0; buf[(J + d1) | 0] &= m1; buf[(J + d2) | 0] &= m2;
      buf[(J + d3) | 0] &= m3; buf[(J + d4) | 0] &= m4; buf[(J + d5) | 0] &= m5;
      buf[(J + d6) | 0] &= m6; buf[(J + d7) | 0] &= m7;
      buf[K] &= m0; buf[(K + d1) | 0] &= m1; buf[(K + d2) | 0] &= m2;
      buf[(K + d3) | 0] &= m3; buf[(K + d4) | 0] &= m4; buf[(K + d5) | 0] &= m5;
      buf[(K + d6) | 0] &= m6; buf[(K + d7) | 0] &= m7;
      J = K + p;
    }
    if (J < stop) {
      buf[J] &= m0; buf[(J + d1) | 0] &= m1; buf[(J + d2) | 0] &= m2;
      buf[(J + d3) | 0] &= m3; buf[(J + d4) | 0] &= m4; buf[(J + d5) | 0] &= m5;
      buf[(J + d6) | 0] &= m6; buf[(J + d7) | 0] &= m7;
      J += p;
    }
    j0 = J; j1 = J + d1; j2 = J + d2; j3 = J + d3; j4 = J + d4; j5 = J + d5; j6 = J + d6; j7 = J + d7;
    // The eight progressions lie within p bytes of each other, so each needs at most one more step
    // (J ≥ end − max d). Taken without branches: whether it is needed is unpredictable. t is −1
    // when the step is needed, else 0; then the write goes to byte 0 with mask 0xff, a no-op.
    let t = (j0 - end) >> 31; buf[j0 & t] &= m0 | ~t; j0 += p & t;
    t = (j1 - end) >> 31; buf[j1 & t] &= m1 | ~t; j1 += p & t;
    t = (j2 - end) >> 31; buf[j2 & t] &= m2 | ~t; j2 += p & t;
    t = (j3 - end) >> 31; buf[j3 & t] &= m3 | ~t; j3 += p & t;
    t = (j4 - end) >> 31; buf[j4 & t] &= m4 | ~t; j4 += p & t;
    t = (j5 - end) >> 31; buf[j5 & t] &= m5 | ~t; j5 += p & t;
    t = (j6 - end) >> 31; buf[j6 & t] &= m6 | ~t; j6 += p & t;
    t = (j7 - end) >> 31; buf[j7 & t] &= m7 | ~t; j7 += p & t;
    next[o] = j0 - shift; next[(o + 1) | 0] = j1 - shift; next[(o + 2) | 0] = j2 - shift; next[(o + 3) | 0] = j3 - shift;
    next[(o + 4) | 0] = j4 - shift; next[(o + 5) | 0] = j5 - shift; next[(o + 6) | 0] = j6 - shift; next[(o + 7) | 0] = j7 - shift;
  }
}

/**
 * Starts the crossing primes sieving[first + i] for i from `active` on (i < count ≤
 * CROSSING_PRIMES_MAX) whose square lies below `end`: for each residue class c, the byte (relative
 * to `base`) of the least multiple p·m ≥ max(p², base) with m ≡ RESIDUES[c] (mod 30). Returns the
 * new number of active primes.
 */
export function activate(sieving: Uint32Array, first: number, count: number, active: number, base: number, end: number): number {
  const next = NEXT;
  const masks = MASKS;
  while (active < count) {
    const p = sieving[first + active]!;
    if (p * p >= end) break;
    PRIMES[active] = p;
    const m0 = firstCofactor(p, base);
    const d = (m0 - 30 * Math.floor(m0 / 30)) << 3;
    const pr = (p % 30) << 3;
    const o = active << 3;
    const rel = p * m0 - base; // small: the multiples are near base
    for (let c = 0; c < 8; c++) {
      const n = rel + p * CLASS_STEP[d + c]!;
      next[o + c] = (n - PRODUCT_RESIDUE[pr + c]!) / 30; // base ≡ 0 (mod 30)
      masks[o + c] = PRODUCT_MASK[pr + c]!;
    }
    active++;
  }
  return active;
}

/**
 * Ends a segment of `len` bytes for the sieving primes i < active: crosses off the look-ahead bytes
 * [len, L) and makes the positions relative to the next segment, in one pass over the progressions.
 */
export function endSegment(active: number, len: number, L: number): void {
  const buf = BUF;
  const next = NEXT;
  const masks = MASKS;
  if (L === len) {
    for (let k = 0, n = active << 3; k < n; k++) next[k] -= len;
    return;
  }
  for (let i = 0; i < active; i++) {
    const p = PRIMES[i]!;
    for (let k = i << 3, e = k + 8; k < e; k++) {
      const j0 = next[k]!;
      next[k] = j0 - len;
      if (j0 < L) {
        const m = masks[k]!;
        for (let j = j0; j < L; j += p) buf[j] &= m;
      }
    }
  }
}

import { inputError } from '../errors';
import { primesUpTo } from '../primes';
import { narrowAdmissibility } from './narrow-admissibility';
import { popcount32 } from './popcount';
import type { NarrowTuple } from './types';

/** Largest k accepted by the exhaustive search (k = 30 takes milliseconds, k = 100 under a second here; the tree grows fast beyond). */
export const EXACT_MAX_K = 100;

/** Search statistics of one exact-diameter test, for benchmarks and docs. */
export interface DiameterSearchStats {
  nodes: number;
}

/**
 * H(k): the least diameter of an admissible k-tuple, with a witness tuple (starting at 0), by
 * exhaustive branch and bound. For each even d (upwards from 2(k−1)) it decides whether an
 * admissible k-tuple of diameter exactly d exists:
 * - such a tuple lies in the even numbers of [0, d], contains 0 and d, and avoids one class r_q
 *   for every odd prime q ≤ k; conversely the survivors of [0, d] after removing one class per
 *   prime are admissible. So the search runs over the residues r_q, never over subsets;
 * - r_q ≠ 0 and r_q ≠ d (mod q), because both end points must survive;
 * - primes in increasing order; a class whose removal leaves fewer than k survivors is skipped
 *   (bound by occupancy counts); an empty allowed class is taken alone (it dominates the others);
 * - mirror symmetry n ↦ d − n maps r_q to d − r_q: while every choice so far is its own mirror,
 *   only the smaller of each mirror pair is explored.
 * The first d that succeeds is H(k) (OEIS A008407 lists the values).
 * @throws EngineError(input) unless 1 ≤ k ≤ EXACT_MAX_K.
 */
export function minimalDiameter(k: number, stats?: DiameterSearchStats): NarrowTuple {
  if (!Number.isSafeInteger(k) || k < 1) throw inputError(`k must be a positive integer, got ${k}`);
  if (k > EXACT_MAX_K) {
    throw inputError(`exhaustive search is limited to k ≤ ${EXACT_MAX_K} (got ${k}); use a construction`);
  }
  if (k === 1) return finish(1, [0]);
  for (let d = 2 * (k - 1); ; d += 2) {
    const found = tupleOfDiameter(k, d, stats);
    if (found) return finish(k, found);
  }
}

function finish(k: number, tuple: number[]): NarrowTuple {
  const check = narrowAdmissibility(tuple);
  if (!check.admissible) throw new Error(`internal: exhaustive search produced an inadmissible tuple`);
  return { k, diameter: tuple[tuple.length - 1] - tuple[0], tuple, witness: check.witness, method: 'exhaustive' };
}

/**
 * An admissible k-tuple inside the even numbers of [0, d] containing 0 and d, or null.
 * Bits index the even numbers: bit i stands for 2i.
 */
export function tupleOfDiameter(k: number, d: number, stats?: DiameterSearchStats): number[] | null {
  const n = d / 2 + 1;
  if (n < k) return null;
  const W = (n + 31) >>> 5;
  const primes = Array.from(primesUpTo(k)).filter((q) => q > 2);
  const P = primes.length;
  // classMask[j][r]: the bits i with 2i ≡ r (mod q_j), W words each.
  const classMask: Uint32Array[][] = primes.map((q) => {
    const masks = Array.from({ length: q }, () => new Uint32Array(W));
    for (let i = 0; i < n; i++) {
      const r = (2 * i) % q;
      masks[r][i >>> 5] |= 1 << (i & 31);
    }
    return masks;
  });
  // Allowed classes and their mirrors.
  const allowed: number[][] = primes.map((q) => {
    const out: number[] = [];
    for (let r = 0; r < q; r++) if (r !== 0 && r !== d % q) out.push(r);
    return out;
  });
  const cur = new Uint32Array((P + 1) * W);
  for (let i = 0; i < n; i++) cur[i >>> 5] |= 1 << (i & 31);
  const occ = new Int32Array(Math.max(1, ...primes));
  const order: number[][] = primes.map((q) => new Array<number>(q));
  let nodes = 0;
  let result: Uint32Array | null = null;

  const count = (base: number): number => {
    let c = 0;
    for (let w = 0; w < W; w++) c += popcount32(cur[base + w]);
    return c;
  };

  const search = (j: number, c: number, symmetric: boolean): boolean => {
    nodes++;
    const base = j * W;
    if (j === P) {
      result = cur.slice(base, base + W);
      return true;
    }
    const q = primes[j];
    const masks = classMask[j];
    const allow = allowed[j];
    // Occupancy of each allowed class among the current survivors.
    let emptyClass = -1;
    for (const r of allow) {
      const m = masks[r];
      let o = 0;
      for (let w = 0; w < W; w++) o += popcount32(cur[base + w] & m[w]);
      occ[r] = o;
      if (o === 0 && emptyClass < 0) emptyClass = r;
    }
    const next = base + W;
    if (emptyClass >= 0) {
      for (let w = 0; w < W; w++) cur[next + w] = cur[base + w];
      const self = (2 * emptyClass) % q === d % q;
      return search(j + 1, c, symmetric && self);
    }
    const slack = c - k;
    const cand = order[j];
    let m = 0;
    for (const r of allow) {
      if (occ[r] > slack) continue;
      if (symmetric) {
        const mirror = (((d - r) % q) + q) % q;
        if (mirror < r) continue;
      }
      cand[m++] = r;
    }
    // Least occupied first: reaches a solution sooner when one exists.
    const sorted = cand.slice(0, m).sort((a, b) => occ[a] - occ[b]);
    for (const r of sorted) {
      const mask = masks[r];
      for (let w = 0; w < W; w++) cur[next + w] = cur[base + w] & ~mask[w];
      const self = (2 * r) % q === d % q;
      const o = occupancyOf(masks, r, base);
      if (search(j + 1, c - o, symmetric && self)) return true;
    }
    return false;
  };
  const occupancyOf = (masks: Uint32Array[], r: number, base: number): number => {
    let o = 0;
    const m = masks[r];
    for (let w = 0; w < W; w++) o += popcount32(cur[base + w] & m[w]);
    return o;
  };

  const found = search(0, count(0), true);
  if (stats) stats.nodes += nodes;
  if (!found || !result) return null;
  const survivors: number[] = [];
  const bits: Uint32Array = result;
  for (let i = 0; i < n; i++) if ((bits[i >>> 5] >>> (i & 31)) & 1) survivors.push(2 * i);
  // 0 and d survive; keep them and the first k − 2 interior survivors.
  return [...survivors.slice(0, k - 1), d];
}

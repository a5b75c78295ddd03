import { limitError } from '../errors';
import { checkLevel, previousPrime } from './primorial';

/** Deepest level whose whole gap cycle is built in memory (23#: 36 495 360 gaps, one byte each). */
export const MAX_MEMORY_LEVEL = 23;

/**
 * The gap cycle of the level after `prev`: replicate the previous cycle p times and remove the
 * multiples of p, merging the two gaps around each removed member. Both cycles start at member 1
 * (the last gap runs from p#−1 to p#+1, i.e. it is 2 for every level ≥ 2).
 * @param prev gap cycle of level P = previous prime (use `Uint8Array.of(1)` for P = 1)
 * @param p the next prime (p must not divide P#)
 * @throws EngineError(limit) when a merged gap exceeds 255 (cannot happen for levels ≤ 23).
 */
export function nextLevelGaps(prev: Uint8Array, p: number): Uint8Array {
  const out = new Uint8Array(prev.length * (p - 1));
  let n = 0;
  let r = 1 % p; // residue of the current position (member 1) modulo p
  let acc = 0;
  for (let c = 0; c < p; c++) {
    for (let j = 0; j < prev.length; j++) {
      const g = prev[j]!;
      r += g;
      while (r >= p) r -= p;
      acc += g;
      if (r !== 0) {
        if (acc > 255) throw limitError(`gap ${acc} at level ${p} does not fit one byte`);
        out[n++] = acc;
        acc = 0;
      }
    }
  }
  if (n !== out.length || acc !== 0) throw new Error(`internal: level ${p} built ${n} gaps, expected ${out.length}`);
  return out;
}

const cache = new Map<number, Uint8Array>();

/**
 * The cycle of gaps of wheel level p (p ≤ 23): gap i runs from member m_i to m_{i+1}, where
 * m_0 = 1 < m_1 < … are the integers in [1, p#] coprime to p#, and the last gap wraps to p# + 1.
 * Length φ(p#). Built by {@link nextLevelGaps} from level 2 and kept in a module cache (treat the
 * result as read-only).
 * @throws EngineError(input) when p is not a prime; EngineError(limit) when p > 23.
 */
export function wheelGaps(p: number): Uint8Array {
  checkLevel(p, MAX_MEMORY_LEVEL);
  const hit = cache.get(p);
  if (hit) return hit;
  const prevPrime = previousPrime(p);
  const prev = prevPrime === 1 ? Uint8Array.of(1) : wheelGaps(prevPrime);
  const gaps = nextLevelGaps(prev, p);
  cache.set(p, gaps);
  return gaps;
}

/** Drops the cached gap cycles (about 50 MB once 23# was built). */
export function clearWheelCache(): void {
  cache.clear();
}

/**
 * The members of level p (p ≤ 19) in [1, p#], increasing, as a Float64Array of integers.
 * @throws EngineError(input) when p is not a prime; EngineError(limit) when p > 19.
 */
export function wheelMembers(p: number): Float64Array {
  if (p > 19) throw limitError(`wheelMembers(${p}): listing members is limited to levels ≤ 19`);
  const gaps = wheelGaps(p);
  const out = new Float64Array(gaps.length);
  let m = 1;
  for (let i = 0; i < gaps.length; i++) {
    out[i] = m;
    m += gaps[i]!;
  }
  return out;
}

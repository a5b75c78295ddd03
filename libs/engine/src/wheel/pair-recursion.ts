import { domainError, inputError } from '../errors';
import { checkLevel, previousPrime } from './primorial';
import type { PatternTally } from './tally';

function parseKey(key: string): number[] {
  return key.split(',').map(Number);
}

function add(map: Map<string, bigint>, key: string, v: bigint): void {
  map.set(key, (map.get(key) ?? 0n) + v);
}

/** Sums a tally of length L over its last gap (length L − 1; valid for full periods). */
export function marginalTally(tally: PatternTally): PatternTally {
  const out = new Map<string, bigint>();
  for (const [key, v] of tally) add(out, key.slice(0, key.lastIndexOf(',')), v);
  return out;
}

/**
 * Ordered pair tally of level p from the quadruple tally of level P (the previous prime), exact
 * when maxGap(P) < 2p (removed members isolated). Level p is level P replicated p times minus the
 * members x ≡ 0 (mod p); as x runs over the removed members its window of level-P gaps runs over
 * the windows of all members of level P once (multiplication by p permutes the reduced residues
 * mod P#). Counting the middle members y of level p by which of their two rep-neighbours are
 * removed (A: left, C: right; never y itself, never two adjacent) gives, with P2, T3, Q the
 * pair, triple and quadruple tallies of level P (quadruple (w₋₁, w₀, w₁, w₂) around an anchor
 * x removed between w₋₁ and w₀):
 *   T2_p(a,b) = (p − 3 + [p | a+b])·P2(a,b) + Σ_{t1+t2=a, t3=b} T3 + Σ_{t1=a, t2+t3=b} T3
 *             + Σ_{p | w₀+w₁} Q·( [w₋₁+w₀=a][w₁+w₂=b] − [w₋₁+w₀=a][w₁=b] − [w₀=a][w₁+w₂=b] ).
 * (The last sum is the case of both neighbours removed: x and the member two steps later.)
 * @param prevQuads tally of consecutive gap quadruples of level P over one period
 * @param p the next prime
 * @throws EngineError(input) for a tally that is not of length 4; EngineError(domain) when a gap of
 *   level P is ≥ 2p.
 */
export function nextPairTally(prevQuads: PatternTally, p: number): PatternTally {
  checkLevel(p);
  const P = previousPrime(p);
  const triples = marginalTally(prevQuads);
  const pairs = marginalTally(triples);
  const out = new Map<string, bigint>();
  const k = BigInt(p - 3);
  for (const [key, v] of pairs) {
    const [a, b] = parseKey(key) as [number, number];
    if (a >= 2 * p || b >= 2 * p) throw domainError(`pair recursion to level ${p} needs gaps of ${P}# below ${2 * p}, found ${Math.max(a, b)}`);
    add(out, key, (k + ((a + b) % p === 0 ? 1n : 0n)) * v);
  }
  for (const [key, v] of triples) {
    const t = parseKey(key);
    if (t.length !== 3) throw inputError('nextPairTally needs a tally of consecutive quadruples');
    add(out, `${t[0]! + t[1]!},${t[2]!}`, v);
    add(out, `${t[0]!},${t[1]! + t[2]!}`, v);
  }
  for (const [key, v] of prevQuads) {
    const [w1, w0, u1, u2] = parseKey(key) as [number, number, number, number];
    if ((w0 + u1) % p !== 0) continue;
    add(out, `${w1 + w0},${u1 + u2}`, v);
    add(out, `${w1 + w0},${u1}`, -v);
    add(out, `${w0},${u1 + u2}`, -v);
  }
  const sorted = [...out.entries()].filter(([, v]) => v !== 0n);
  sorted.sort((x, y) => {
    const a = parseKey(x[0]);
    const b = parseKey(y[0]);
    return a[0]! - b[0]! || a[1]! - b[1]!;
  });
  for (const [, v] of sorted) if (v < 0n) throw new Error('internal: negative pair count');
  return new Map(sorted);
}

import { domainError } from '../errors';
import { checkLevel, previousPrime } from './primorial';
import { histogramMaxGap, type GapHistogram } from './tally';

/**
 * One step of the histogram recursion from level P = previous prime to level p:
 *   hist_p(g) = (p − 2)·hist_P(g) + T2_P(g),
 * where T2_P(g) counts consecutive gap pairs of level P summing to g.
 * Why: level p is level P replicated p times minus the members p·r (r a member of level P);
 * multiplication by p permutes the members mod P#, so the (left gap, right gap) pairs around the
 * removed members are, as a multiset, exactly the consecutive gap pairs of level P. Removing an
 * isolated member destroys its two gaps and creates their sum. Two removed members can only be
 * adjacent if a gap of level P is a multiple of p, i.e. ≥ 2p (gaps are even, p is odd) — so the
 * formula is exact when maxGap(P) < 2p.
 * @param prevHistogram histogram of level P
 * @param prevPairSums T2_P (see {@link pairSums})
 * @throws EngineError(domain) when maxGap(P) ≥ 2p (removed members may be adjacent: stream level p instead).
 */
export function nextHistogram(prevHistogram: GapHistogram, prevPairSums: GapHistogram, p: number): GapHistogram {
  checkLevel(p);
  const P = previousPrime(p);
  const J = histogramMaxGap(prevHistogram);
  if (J >= 2 * p) {
    throw domainError(`histogram recursion to level ${p} needs maxGap(${P}#) < ${2 * p}, but it is ${J}`);
  }
  const acc = new Map<number, bigint>();
  const k = BigInt(p - 2);
  for (const [g, v] of prevHistogram) acc.set(g, k * v);
  for (const [g, v] of prevPairSums) acc.set(g, (acc.get(g) ?? 0n) + v);
  const out = new Map<number, bigint>();
  for (const g of [...acc.keys()].sort((a, b) => a - b)) if (acc.get(g)! !== 0n) out.set(g, acc.get(g)!);
  return out;
}

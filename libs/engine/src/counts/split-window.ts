// The counting step of the split route for one window of base members: how the primes above the
// base level cover the members that follow x (inclusion–exclusion over those primes only).

/**
 * For the base members x + w_1 < x + w_2 < … < x + w_M after a base member x (offsets `points`,
 * point 0 = x itself implied) and the primes `primes` (each above the base level), the number of
 * residue choices c_q (mod q, one per prime, c_q ≠ 0) such that the first point j ≥ 1 not hit —
 * hit by q means c_q + w_j ≡ 0 (mod q) — is point k; returned as F[k], k = 1 … M (F[0] = 0).
 * In the level above, these choices are exactly the members y ≡ x (mod base#) whose gap is w_k.
 *
 * By inclusion–exclusion, G_k = #(points 1 … k−1 all hit) = Σ_{S ⊆ {1 … k−1}} (−1)^{|S|}
 * ∏_q (q − ν_q({0} ∪ S)), ν_q = number of residue classes mod q met; F_k = G_k − G_{k+1}. One walk
 * over the subsets of {1 … M} gives every G_k at once (a subset with largest element j counts
 * towards every G_k with k > j). The caller takes M large enough that the points cannot all be hit
 * (G_{M+1} = 0, checked here).
 * Exact: doubles while ∏(q − 1)·2^M < 2^53, bigints otherwise.
 * @throws Error (internal) when G_{M+1} ≠ 0.
 */
export function windowFirstUncovered(points: readonly number[], primes: readonly number[]): bigint[] {
  const M = points.length;
  const Q = primes.length;
  const classes = primes.map((q) => Int32Array.from(points, (w) => w % q));
  const counts = primes.map((q) => new Int32Array(q));
  const nu = new Int32Array(Q);
  for (let i = 0; i < Q; i++) {
    counts[i]![0] = 1; // point 0
    nu[i] = 1;
  }
  let maxProduct = 1;
  for (const q of primes) maxProduct *= q - 1;
  const exact = maxProduct * 2 ** M < 2 ** 53;
  const D = new Float64Array(M + 1);
  const Dbig: bigint[] = exact ? [] : new Array<bigint>(M + 1).fill(0n);
  const visit = (start: number, sign: number, last: number): void => {
    if (exact) {
      let prod = sign;
      for (let i = 0; i < Q; i++) prod *= primes[i]! - nu[i]!;
      D[last] += prod;
    } else {
      let prod = BigInt(sign);
      for (let i = 0; i < Q; i++) prod *= BigInt(primes[i]! - nu[i]!);
      Dbig[last] = Dbig[last]! + prod;
    }
    for (let c = start; c < M; c++) {
      for (let i = 0; i < Q; i++) if (counts[i]![classes[i]![c]!]!++ === 0) nu[i]!++;
      visit(c + 1, -sign, c + 1);
      for (let i = 0; i < Q; i++) if (--counts[i]![classes[i]![c]!]! === 0) nu[i]!--;
    }
  };
  visit(0, 1, 0);
  const G: bigint[] = new Array<bigint>(M + 2).fill(0n);
  let acc = 0n;
  for (let k = 1; k <= M + 1; k++) {
    acc += exact ? BigInt(D[k - 1]!) : Dbig[k - 1]!;
    G[k] = acc;
  }
  if (G[M + 1] !== 0n) throw new Error(`internal: window ${points.join(',')} can be covered entirely (G = ${G[M + 1]})`);
  const F: bigint[] = [0n];
  for (let k = 1; k <= M; k++) F.push(G[k]! - G[k + 1]!);
  return F;
}

/**
 * E[n] for n = 0 … |primes| + 1: the number of residue choices c_q ≠ 0 (one per prime) hitting n
 * given points that are distinct modulo every prime and distinct from point 0:
 * E[n] = Σ_j (−1)^j·C(n, j)·∏_q (q − 1 − j). E[|primes| + 1] = 0 (each prime hits one point).
 */
export function genericCoverCounts(primes: readonly number[]): bigint[] {
  const out: bigint[] = [];
  for (let n = 0; n <= primes.length + 1; n++) {
    let sum = 0n;
    let binom = 1n;
    for (let j = 0; j <= n; j++) {
      let prod = 1n;
      for (const q of primes) prod *= BigInt(q - 1 - j);
      sum += (j % 2 === 0 ? binom : -binom) * prod;
      binom = (binom * BigInt(n - j)) / BigInt(j + 1);
    }
    out.push(sum);
  }
  if (out[primes.length + 1] !== 0n) throw new Error('internal: generic cover count of |primes| + 1 points is not 0');
  return out;
}

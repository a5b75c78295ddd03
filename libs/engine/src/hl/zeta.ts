import { inputError } from '../errors';
import { fixedOne } from './fixed-point';

/**
 * Riemann ζ(s) at integers s ≥ 2 in binary fixed point, by P. Borwein's algorithm 2
 * ("An efficient algorithm for the Riemann zeta function", 2000): with
 * d_k = n·Σ_{i≤k} (n+i−1)!·4^i / ((n−i)!·(2i)!),
 * ζ(s) = −1/(d_n·(1 − 2^(1−s))) · Σ_{k<n} (−1)^k (d_k − d_n)/(k+1)^s, error below 3/(3+√8)^n relative
 * to 1/|1 − 2^(1−s)|. One instance serves every s at one precision (the d_k are shared).
 */
export class ZetaAtIntegers {
  private readonly guard = 16;
  private readonly n: number;
  private readonly d: bigint[];
  private readonly cache = new Map<number, bigint>();

  /** @param bits binary digits after the point of every value returned. */
  constructor(readonly bits: number) {
    const b = bits + this.guard;
    // (3 + √8)^n > 2^(b + 4) suffices.
    this.n = Math.ceil((b + 4) / Math.log2(3 + Math.sqrt(8))) + 1;
    const n = this.n;
    const one = fixedOne(b);
    const fact: bigint[] = [1n];
    for (let i = 1; i <= 2 * n; i++) fact.push(fact[i - 1]! * BigInt(i));
    this.d = [];
    let acc = 0n;
    for (let i = 0; i <= n; i++) {
      acc += (one * BigInt(n) * fact[n + i - 1]! * 4n ** BigInt(i)) / (fact[n - i]! * fact[2 * i]!);
      this.d.push(acc);
    }
  }

  /**
   * ζ(s) · 2^bits, rounded down within a few units.
   * @throws EngineError(input) for s < 2 or not an integer.
   */
  value(s: number): bigint {
    if (!Number.isSafeInteger(s) || s < 2) throw inputError(`ζ(s) is computed for integers s ≥ 2, not ${s}`);
    const hit = this.cache.get(s);
    if (hit !== undefined) return hit;
    const b = this.bits + this.guard;
    let z: bigint;
    if (s > b + 2) {
      z = fixedOne(b); // ζ(s) − 1 < 2^(1−s) is below the precision.
    } else {
      const n = this.n;
      const dn = this.d[n]!;
      let sum = 0n;
      for (let k = 0; k < n; k++) {
        const t = (this.d[k]! - dn) / BigInt(k + 1) ** BigInt(s);
        sum += k % 2 === 0 ? t : -t;
      }
      const den = dn - (dn >> BigInt(s - 1)); // d_n·(1 − 2^(1−s))
      z = (-sum * fixedOne(b)) / den;
    }
    const out = z >> BigInt(this.guard);
    this.cache.set(s, out);
    return out;
  }
}

import { fixedLn1p, fixedOne } from './fixed-point';
import { ZetaAtIntegers } from './zeta';

/** Möbius μ(n) for a small positive integer n. */
export function moebius(n: number): number {
  let m = n;
  let sign = 1;
  for (let p = 2; p * p <= m; p++) {
    if (m % p !== 0) continue;
    m /= p;
    if (m % p === 0) return 0;
    sign = -sign;
  }
  return m > 1 ? -sign : sign;
}

/**
 * Tails of the prime zeta function, P_Q(s) = Σ_{q prime, q > Q} q^(−s) for integers s ≥ 2, in binary
 * fixed point with `bits` digits. By Möbius inversion of log ζ_Q(s) = Σ_{q>Q} −log(1 − q^(−s)), where
 * ζ_Q(s) = ζ(s)·∏_{q≤Q} (1 − q^(−s)): P_Q(s) = Σ_{n≥1} μ(n)/n · log ζ_Q(ns). Since log ζ_Q(ns) is
 * about Q^(−ns), the series stops as soon as Q^(ns) passes 2^bits. `primes` are all primes ≤ Q.
 */
export class PrimeZetaTail {
  private readonly zeta: ZetaAtIntegers;
  private readonly logZetaQ = new Map<number, bigint>();
  private readonly Q: number;

  constructor(
    readonly bits: number,
    private readonly primes: Uint32Array,
  ) {
    this.zeta = new ZetaAtIntegers(bits);
    this.Q = primes.length > 0 ? primes[primes.length - 1]! : 1;
  }

  /** P_Q(s)·2^bits for an integer s ≥ 2. */
  value(s: number): bigint {
    let sum = 0n;
    const log2Q = Math.log2(this.Q + 1);
    for (let n = 1; n * s * log2Q <= this.bits + 8; n++) {
      const mu = moebius(n);
      if (mu === 0) continue;
      const t = this.logZetaAbove(n * s) / BigInt(n);
      sum += mu > 0 ? t : -t;
    }
    return sum;
  }

  /** log ζ_Q(t)·2^bits. */
  private logZetaAbove(t: number): bigint {
    const hit = this.logZetaQ.get(t);
    if (hit !== undefined) return hit;
    let z = this.zeta.value(t);
    const bt = BigInt(t);
    for (let i = 0; i < this.primes.length; i++) {
      const step = z / BigInt(this.primes[i]!) ** bt;
      if (step === 0n) break;
      z -= step;
    }
    const out = fixedLn1p(z - fixedOne(this.bits), this.bits);
    this.logZetaQ.set(t, out);
    return out;
  }
}

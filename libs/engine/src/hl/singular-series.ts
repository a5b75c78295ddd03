import { domainError, limitError } from '../errors';
import { primesUpTo } from '../primes/small-primes';
import { admissibility, normalizeTuple } from '../tuple';
import { expToDecimal, fixedLnRatio } from './fixed-point';
import { PrimeZetaTail } from './prime-zeta';

/** Largest k accepted by {@link singularSeries}. */
export const SINGULAR_SERIES_MAX_K = 5000;
/** Largest diameter accepted by {@link singularSeries}. */
export const SINGULAR_SERIES_MAX_DIAMETER = 10_000_000;

/** The Hardy–Littlewood constant of a pattern. */
export interface SingularSeries {
  /** H normalized (increasing, from 0). */
  readonly pattern: readonly number[];
  readonly k: number;
  /** S(H) as a double (Infinity only if S(H) ≥ 1.8·10^308; then use `decimal`). */
  readonly value: number;
  /** S(H) rounded to `digits` significant digits, scientific notation ("1.32…e+0"). */
  readonly decimal: string;
  /** Significant digits of `decimal` (all correct, see the error budget in docs/engine.md). */
  readonly digits: number;
  /** ln S(H) as a double. */
  readonly log: number;
  /** The bound Q of the exact finite product (primes q ≤ Q); beyond it the prime-zeta tail. */
  readonly finiteBound: number;
}

/** Options of {@link singularSeries} (tests vary the split point to check the tail). */
export interface SingularSeriesOptions {
  /** Exact product over q ≤ this bound (default max(1000, diameter + 1, 32k)); must be ≥ diameter + 1 and ≥ 2k. */
  readonly finiteBound?: number;
  /** Significant digits of `decimal` (default 20, at most 30). */
  readonly digits?: number;
}

const TARGET_BITS = 112; // ≈ 33 decimal digits of ln S before rounding to `digits`.

/**
 * The singular series S(H) = ∏_q (1 − ν_q(H)/q)(1 − 1/q)^(−k) of an admissible k-tuple H.
 * Method: ln S = Σ_{q≤Q} [ln(1 − ν_q/q) − k ln(1 − 1/q)] exactly (binary fixed point, each logarithm
 * by the atanh series), plus the tail over q > Q, where ν_q = k because Q > diam H:
 * Σ_{q>Q} [ln(1 − k/q) − k ln(1 − 1/q)] = Σ_{m≥2} (k − k^m)/m · P_Q(m), with the prime zeta tails
 * P_Q(m) from ζ at integers by Möbius inversion ({@link PrimeZetaTail}); the terms fall like (k/Q)^m.
 * @throws EngineError(input) for a malformed tuple; EngineError(domain) for a non-admissible one
 *   (S(H) = 0); EngineError(limit) for k > 5000, diameter > 10^7, or a bad finiteBound.
 */
export function singularSeries(
  values: ReadonlyArray<number | bigint | string>,
  options: SingularSeriesOptions = {},
): SingularSeries {
  const H = normalizeTuple(values);
  const k = H.length;
  const diameter = H[k - 1]!;
  if (k > SINGULAR_SERIES_MAX_K) throw limitError(`singular series of a ${k}-tuple: k is above ${SINGULAR_SERIES_MAX_K}`);
  if (diameter > SINGULAR_SERIES_MAX_DIAMETER) {
    throw limitError(`singular series: diameter ${diameter} is above ${SINGULAR_SERIES_MAX_DIAMETER}`);
  }
  const verdict = admissibility(H);
  if (!verdict.admissible) {
    throw domainError(
      `S(H) = 0: {${H.join(',')}} is not admissible (it covers every residue mod ${verdict.obstruction.prime})`,
    );
  }
  const digits = options.digits ?? 20;
  if (!Number.isSafeInteger(digits) || digits < 1 || digits > 30) throw limitError(`digits ${digits} not in 1 … 30`);
  const Q = options.finiteBound ?? Math.max(1000, diameter + 1, 32 * k);
  if (!Number.isSafeInteger(Q) || Q <= diameter || Q < 2 * k || Q > 2e8) {
    throw limitError(`finite bound ${Q} must exceed the diameter ${diameter} and 2k = ${2 * k} (and stay ≤ 2·10^8)`);
  }
  const log2k = Math.log2(Math.max(k, 2));
  const terms = Math.ceil(TARGET_BITS / Math.log2(Q / k)) + 2;
  const bits = TARGET_BITS + Math.ceil(terms * log2k) + 32;
  const primes = primesUpTo(Q);

  // Exact part: Σ_{q ≤ Q} ln((q − ν_q)/q) − k·ln((q − 1)/q).
  let logS = 0n;
  const seen = new Int32Array(Math.min(Q, diameter + 1) + 1);
  const bk = BigInt(k);
  for (let i = 0; k >= 2 && i < primes.length; i++) {
    const q = primes[i]!;
    let nu = k;
    if (q <= diameter) {
      nu = 0;
      const stamp = i + 1;
      for (const h of H) {
        const r = h % q;
        if (seen[r] !== stamp) {
          seen[r] = stamp;
          nu++;
        }
      }
    }
    const bq = BigInt(q);
    logS += fixedLnRatio(bq - BigInt(nu), bq, bits) - bk * fixedLnRatio(bq - 1n, bq, bits);
  }
  if (k >= 2) {
    const tail = new PrimeZetaTail(bits, primes);
    for (let m = 2; ; m++) {
      const coefficientNum = bk - bk ** BigInt(m); // (k − k^m), divided by m below
      const term = (coefficientNum * tail.value(m)) / BigInt(m);
      logS += term;
      if (m >= terms || (term === 0n && m > 2)) break;
    }
  }
  const dec = expToDecimal(logS, bits, digits);
  return {
    pattern: H,
    k,
    value: Number(dec.text),
    decimal: dec.text,
    digits,
    log: Number((logS * 1_000_000_000_000n) >> BigInt(bits)) / 1e12,
    finiteBound: Q,
  };
}

import { domainError } from '../errors';
import { gcd } from '../primes/gcd';

/** An exact rational number num/den with den > 0 and gcd(num, den) = 1. */
export interface Rational {
  readonly num: bigint;
  readonly den: bigint;
}

/**
 * The rational num/den in lowest terms.
 * @throws EngineError(domain) when den = 0.
 */
export function rational(num: bigint, den = 1n): Rational {
  if (den === 0n) throw domainError(`rational ${num}/0 has a zero denominator`);
  if (den < 0n) {
    num = -num;
    den = -den;
  }
  const g = gcd(num, den);
  return g > 1n ? { num: num / g, den: den / g } : { num, den };
}

/** a + b. */
export const ratAdd = (a: Rational, b: Rational): Rational => rational(a.num * b.den + b.num * a.den, a.den * b.den);
/** a − b. */
export const ratSub = (a: Rational, b: Rational): Rational => rational(a.num * b.den - b.num * a.den, a.den * b.den);
/** a · b. */
export const ratMul = (a: Rational, b: Rational): Rational => rational(a.num * b.num, a.den * b.den);
/** a / b. @throws EngineError(domain) when b = 0. */
export const ratDiv = (a: Rational, b: Rational): Rational => {
  if (b.num === 0n) throw domainError('division of a rational by zero');
  return rational(a.num * b.den, a.den * b.num);
};
/** a = 0. */
export const ratIsZero = (a: Rational): boolean => a.num === 0n;
/** a = b (both in lowest terms). */
export const ratEquals = (a: Rational, b: Rational): boolean => a.num === b.num && a.den === b.den;
/** "a" for integers, "a/b" otherwise. */
export const ratToString = (a: Rational): string => (a.den === 1n ? `${a.num}` : `${a.num}/${a.den}`);

/**
 * Solves A·x = b exactly (Gaussian elimination over the rationals), A square.
 * @throws EngineError(domain) when A is singular (the message names the first dependent column).
 */
export function solveRational(A: readonly (readonly Rational[])[], b: readonly Rational[]): Rational[] {
  const n = A.length;
  const M = A.map((row, i) => [...row, b[i]!]);
  for (let col = 0; col < n; col++) {
    let piv = col;
    while (piv < n && ratIsZero(M[piv]![col]!)) piv++;
    if (piv === n) throw domainError(`the system is singular: column ${col + 1} depends on the others`);
    [M[col], M[piv]] = [M[piv]!, M[col]!];
    const pr = M[col]!;
    for (let r = 0; r < n; r++) {
      if (r === col || ratIsZero(M[r]![col]!)) continue;
      const f = ratDiv(M[r]![col]!, pr[col]!);
      M[r] = M[r]!.map((v, j) => ratSub(v, ratMul(f, pr[j]!)));
    }
  }
  return M.map((row, i) => ratDiv(row[n]!, row[i]!));
}

import { inputError } from '../errors';
import { isSmallPrime, primesUpTo } from '../primes/small-primes';
import { checkLevel, productTree } from '../wheel/primorial';
import { rational, ratAdd, ratEquals, ratMul, ratToString, solveRational, type Rational } from './rational';

/** A value of a series at one wheel level (e.g. a gap count in one period of p#). */
export interface LevelValue {
  readonly level: number;
  readonly value: bigint;
}

/** Basis of products B_s(p) = ∏_{from ≤ q ≤ p, q prime}(q − s), one per shift s (empty product = 1). */
export interface ProductBasis {
  readonly from: number;
  readonly shifts: readonly number[];
}

/** One checked level beyond the fitted ones. */
export interface FitCheck {
  readonly level: number;
  readonly value: bigint;
  readonly predicted: Rational;
  readonly holds: boolean;
}

/** Result of {@link fitProductBasis}. */
export interface FitResult {
  readonly basis: ProductBasis;
  readonly coefficients: readonly Rational[];
  /** true when every coefficient is an integer */
  readonly integral: boolean;
  /** e.g. "2·∏(q−2) − 2·∏(q−3)" */
  readonly text: string;
  /** e.g. "∏ over primes 5 ≤ q ≤ p" */
  readonly range: string;
  /** levels whose values determined the coefficients */
  readonly fittedLevels: readonly number[];
  /** the remaining levels, each with the prediction and whether it matches */
  readonly checks: readonly FitCheck[];
  /** levels where the formula was checked and holds (fitted ones included) */
  readonly holdsAt: readonly number[];
  /** least checked level where it fails, or null */
  readonly firstFailure: number | null;
}

/**
 * B_s(p) = ∏_{from ≤ q ≤ p}(q − s) over primes q (1 when p < from).
 * @throws EngineError(input) when p or from is not a prime.
 */
export function productBasisValue(from: number, shift: number, p: number): bigint {
  checkLevel(p);
  if (!isSmallPrime(from)) throw inputError(`basis start ${from} is not a prime`);
  return productTree(Array.from(primesUpTo(p)).filter((q) => q >= from).map((q) => BigInt(q - shift)));
}

/**
 * Fits a series of values at increasing levels to Σ c_s·∏_{from ≤ q ≤ p}(q − s) exactly: the first
 * m = |shifts| levels determine the rational coefficients (Gaussian elimination with bigint
 * rationals), every further level is checked. Example: gap-6 counts at levels 5 … 23 on shifts
 * [2, 3] from 5 give 2·∏(q−2) − 2·∏(q−3), holding at every level given.
 * @throws EngineError(input) for levels that are not increasing primes, an empty or repeated basis,
 *   fewer values than basis products; EngineError(domain) when the fitted levels give a singular system.
 */
export function fitProductBasis(series: readonly LevelValue[], basis: ProductBasis): FitResult {
  const shifts = basis.shifts;
  if (shifts.length === 0) throw inputError('the basis needs at least one product');
  if (new Set(shifts).size !== shifts.length) throw inputError(`basis shifts ${shifts.join(',')} repeat`);
  for (const s of shifts) if (!Number.isSafeInteger(s)) throw inputError(`basis shift ${s} is not an integer`);
  if (!isSmallPrime(basis.from)) throw inputError(`basis start ${basis.from} is not a prime`);
  for (let i = 0; i < series.length; i++) {
    checkLevel(series[i]!.level);
    if (i > 0 && series[i]!.level <= series[i - 1]!.level) {
      throw inputError(`levels must increase: ${series[i - 1]!.level} then ${series[i]!.level}`);
    }
  }
  const m = shifts.length;
  if (series.length < m) throw inputError(`${m} basis products need at least ${m} values, got ${series.length}`);
  const row = (p: number) => shifts.map((s) => rational(productBasisValue(basis.from, s, p)));
  const fitted = series.slice(0, m);
  const coefficients = solveRational(
    fitted.map((v) => row(v.level)),
    fitted.map((v) => rational(v.value)),
  );
  const predict = (p: number) => row(p).reduce((acc, b, i) => ratAdd(acc, ratMul(b, coefficients[i]!)), rational(0n));
  const checks: FitCheck[] = series.slice(m).map((v) => {
    const predicted = predict(v.level);
    return { level: v.level, value: v.value, predicted, holds: ratEquals(predicted, rational(v.value)) };
  });
  const failure = checks.find((c) => !c.holds);
  return {
    basis: { from: basis.from, shifts: [...shifts] },
    coefficients,
    integral: coefficients.every((c) => c.den === 1n),
    text: formatRationalForm(coefficients, shifts),
    range: `∏ over primes ${basis.from} ≤ q ≤ p (empty product = 1)`,
    fittedLevels: fitted.map((v) => v.level),
    checks,
    holdsAt: [...fitted.map((v) => v.level), ...checks.filter((c) => c.holds).map((c) => c.level)],
    firstFailure: failure ? failure.level : null,
  };
}

/** "2·∏(q−2) − (3/2)·∏(q−3)"; zero coefficients are left out ("0" when all vanish). */
export function formatRationalForm(coefficients: readonly Rational[], shifts: readonly number[]): string {
  const parts: string[] = [];
  coefficients.forEach((c, i) => {
    if (c.num === 0n) return;
    const neg = c.num < 0n;
    const abs = rational(neg ? -c.num : c.num, c.den);
    const coef = abs.den === 1n ? (abs.num === 1n ? '' : `${abs.num}·`) : `(${ratToString(abs)})·`;
    const s = shifts[i]!;
    const body = `${coef}∏(q${s >= 0 ? `−${s}` : `+${-s}`})`;
    parts.push(parts.length === 0 ? (neg ? `−${body}` : body) : `${neg ? ' − ' : ' + '}${body}`);
  });
  return parts.length === 0 ? '0' : parts.join('');
}

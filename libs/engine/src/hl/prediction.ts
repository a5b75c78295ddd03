import { inputError, limitError } from '../errors';
import { combinePrimeBlocks } from '../sieve/combine';
import { compilePattern } from '../sieve/pattern';
import type { PrimeBlock } from '../sieve/prime-block';
import { checkStop, partHooks, type WorkHooks } from '../sieve/progress';
import { parseSieveRange, sieveCompiled, type RangeEnd } from '../sieve/range';
import { logIntegralK } from './log-integral';
import { singularSeries } from './singular-series';

/** The Hardy–Littlewood prediction S(H)·Li_k(x) for the number of n ≤ x with n + h prime for all h ∈ H. */
export interface HardyLittlewoodPrediction {
  readonly pattern: readonly number[];
  readonly x: bigint;
  /** S(H) (double). */
  readonly constant: number;
  /** Li_k(x) = ∫_2^x dt / ln^k t. */
  readonly logIntegral: number;
  /** S(H)·Li_k(x). */
  readonly predicted: number;
}

/** Prediction beside the actual count from the sieve. */
export interface HardyLittlewoodComparison extends HardyLittlewoodPrediction {
  /** #{n ≥ 0 : n + h prime for all h ∈ H, n + max H ≤ x}. */
  readonly actual: number;
  /** actual − predicted. */
  readonly difference: number;
  /** actual / predicted. */
  readonly ratio: number;
}

/**
 * S(H)·Li_k(x), the Hardy–Littlewood prediction for the count of n ≤ x with every n + h prime
 * (x any integer from 2 to 10^300; no sieving).
 * @throws EngineError(input) for a malformed x; as {@link singularSeries} and {@link logIntegralK}.
 */
export function hardyLittlewoodPrediction(
  pattern: ReadonlyArray<number | bigint | string>,
  x: RangeEnd,
): HardyLittlewoodPrediction {
  const s = singularSeries(pattern);
  const X = toBigEnd(x);
  const li = logIntegralK(s.k, X);
  return { pattern: s.pattern, x: X, constant: s.value, logIntegral: li, predicted: s.value * li };
}

/**
 * The prediction S(H)·Li_k(x) beside the actual count of n ≥ 0 with n + h prime for all h ∈ H and
 * n + max H ≤ x (segmented sieve of [0, x]; `hooks` report its progress and may stop it, as in
 * {@link sievePrimeBlock}).
 * @throws EngineError as {@link hardyLittlewoodPrediction} and the sieve (x ≤ 10^15; limit when stopped).
 */
export function compareWithHardyLittlewood(
  pattern: ReadonlyArray<number | bigint | string>,
  x: RangeEnd,
  hooks: WorkHooks = {},
): HardyLittlewoodComparison {
  const p = hardyLittlewoodPrediction(pattern, x);
  const range = parseSieveRange(0n, p.x);
  const block = sieveCompiled(range.from, range.to, [compilePattern(p.pattern)], false, hooks);
  const actual = block.patterns[0]!.count;
  return { ...p, actual, difference: actual - p.predicted, ratio: actual / p.predicted };
}

/** A sign change of actual − predicted between two consecutive samples. */
export interface HardyLittlewoodCrossing {
  /** Last sample with the old sign. */
  readonly after: bigint;
  /** First sample with the new sign. */
  readonly before: bigint;
  /** 'up' when actual − predicted turns positive, 'down' when it turns negative. */
  readonly direction: 'up' | 'down';
}

/** Result of {@link hardyLittlewoodCrossings}. */
export interface HardyLittlewoodCrossings {
  readonly pattern: readonly number[];
  readonly constant: number;
  /** The samples x_j = from + j·step (and `to`), j ≥ 1. */
  readonly samples: number;
  readonly crossings: readonly HardyLittlewoodCrossing[];
  /** The comparison at the last sample. */
  readonly last: { readonly x: bigint; readonly actual: number; readonly predicted: number };
}

/** Options of {@link hardyLittlewoodCrossings}: the sampled range and step, optional progress and stop hooks. */
export interface HardyLittlewoodCrossingsOptions extends WorkHooks {
  readonly from?: RangeEnd;
  readonly to: RangeEnd;
  readonly step: RangeEnd;
}

/** Progress of {@link hardyLittlewoodCrossings} is reported (and a stop checked) each time another 1/REPORTS of the range is done. */
const REPORTS = 256;
/** Steps at least this long are sieved with the hooks passed down (several sieve segments each). */
const LONG_STEP = 60_000_000n;

/** Largest number of samples {@link hardyLittlewoodCrossings} takes. */
export const MAX_CROSSING_SAMPLES = 1_000_000;

/**
 * The sign changes of actual(x) − S(H)·Li_k(x) sampled at x = from + step, from + 2·step, …, to
 * (actual(x) counts n ≥ 0 with every n + h prime and n + max H ≤ x). Samples where the difference is
 * exactly 0 carry no sign. One sieve pass: each step is a block combined into the running total.
 * `onProgress` gets the fraction of [0, to] sieved (every 1/256 of it, or every few sieve segments
 * for long steps) and `shouldStop` is polled at the same points.
 * @throws EngineError(input) for from < 2, step < 1, to ≤ from; EngineError(limit) for more than
 *   10^6 samples, to > 10^15 or when `shouldStop` answers true; and as {@link singularSeries}.
 */
export function hardyLittlewoodCrossings(
  pattern: ReadonlyArray<number | bigint | string>,
  options: HardyLittlewoodCrossingsOptions,
): HardyLittlewoodCrossings {
  const s = singularSeries(pattern);
  const cp = compilePattern(s.pattern);
  const from = toBigEnd(options.from ?? 2n);
  const step = toBigEnd(options.step);
  const { to } = parseSieveRange(0n, options.to);
  if (from < 2n) throw inputError(`crossings: from ${from} is below 2`);
  if (step < 1n) throw inputError(`crossings: step ${step} is not positive`);
  if (to <= from) throw inputError(`crossings: to ${to} is not above from ${from}`);
  const samples = (to - from + step - 1n) / step;
  if (samples > BigInt(MAX_CROSSING_SAMPLES)) {
    throw limitError(`crossings: ${samples} samples is above ${MAX_CROSSING_SAMPLES} (raise step)`);
  }
  const hooks: WorkHooks = { onProgress: options.onProgress, shouldStop: options.shouldStop };
  const what = `comparing with the prediction over [${from}, ${to}]`;
  const share = (v: bigint): number => Number(v) / Number(to);
  let total: PrimeBlock = sieveCompiled(0n, from, [cp], false, partHooks(hooks, 0, share(from), what));
  const crossings: HardyLittlewoodCrossing[] = [];
  let sign = 0;
  let lastSignedAt = from;
  let x = from;
  let predicted = 0;
  let reported = Math.floor(share(from) * REPORTS);
  while (x < to) {
    const nx = x + step > to ? to : x + step;
    const part = nx - x >= LONG_STEP ? partHooks(hooks, share(x), share(nx), what) : undefined;
    total = combinePrimeBlocks(total, sieveCompiled(x + 1n, nx, [cp], false, part));
    x = nx;
    const mark = Math.floor(share(x) * REPORTS);
    if (mark > reported) {
      reported = mark;
      checkStop(hooks, what);
      // A long step's sieve has reported its own end already.
      if (!part) hooks.onProgress?.(share(x), what);
    }
    predicted = s.value * logIntegralK(s.k, x);
    const d = total.patterns[0]!.count - predicted;
    const sg = d > 0 ? 1 : d < 0 ? -1 : 0;
    if (sg !== 0) {
      if (sign !== 0 && sg !== sign) crossings.push({ after: lastSignedAt, before: x, direction: sg > 0 ? 'up' : 'down' });
      sign = sg;
      lastSignedAt = x;
    }
  }
  return {
    pattern: s.pattern,
    constant: s.value,
    samples: Number(samples),
    crossings,
    last: { x, actual: total.patterns[0]!.count, predicted },
  };
}

/** A non-negative integer of any size (decimal string, "1e20" form, bigint or safe number). */
function toBigEnd(v: RangeEnd): bigint {
  if (typeof v === 'bigint') {
    if (v < 0n) throw inputError(`${v} is negative`);
    return v;
  }
  if (typeof v === 'number' && Number.isSafeInteger(v) && v >= 0) return BigInt(v);
  const m = /^\s*(\d+)(?:e(\d+))?\s*$/i.exec(String(v));
  if (!m || Number(m[2] ?? 0) > 300) throw inputError(`"${String(v)}" is not a non-negative integer up to 10^300`);
  return BigInt(m[1]!) * 10n ** BigInt(m[2] ?? '0');
}

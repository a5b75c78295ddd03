import { describe, expect, it } from 'vitest';
import { primesUpTo } from '../primes/small-primes';
import { logIntegralK } from './log-integral';
import { compareWithHardyLittlewood, hardyLittlewoodCrossings, hardyLittlewoodPrediction } from './prediction';
import { singularSeries } from './singular-series';

describe('Hardy–Littlewood predictions beside actual counts', () => {
  it('twins to 10^8: actual 440312 (OEIS A007508) beside 2·C2·Li_2(10^8)', () => {
    const c = compareWithHardyLittlewood([0, 2], 100_000_000);
    expect(c.actual).toBe(440312);
    expect(c.predicted).toBeCloseTo(singularSeries([0, 2]).value * logIntegralK(2, 1e8), 6);
    expect(Math.abs(c.ratio - 1)).toBeLessThan(1e-3);
    expect(c.difference).toBeCloseTo(c.actual - c.predicted, 9);
  });
  it('prediction for quadruplets uses k = 4', () => {
    const p = hardyLittlewoodPrediction([0, 2, 6, 8], '1e9');
    expect(p.predicted).toBeCloseTo(p.constant * logIntegralK(4, 1e9), 6);
    expect(p.x).toBe(1_000_000_000n);
  });
  it('predicts beyond the sieve limit (x = 10^20) and refuses malformed x', () => {
    const p = hardyLittlewoodPrediction([0, 2], '1e20');
    expect(p.x).toBe(10n ** 20n);
    expect(p.predicted).toBeCloseTo(p.constant * logIntegralK(2, 1e20), -2);
    expect(() => hardyLittlewoodPrediction([0, 2], 'ten')).toThrow(/not a non-negative integer/);
    expect(() => compareWithHardyLittlewood([0, 2], '1e16')).toThrow(/above the sieve limit/);
  });
});

describe('crossings of actual − predicted', () => {
  it('match a recount from a plain prime list (twins to 4·10^6, step 2·10^4)', () => {
    const to = 4_000_000;
    const step = 20_000;
    const result = hardyLittlewoodCrossings([0, 2], { to, step });
    // Independent count: twin pairs (p, p + 2) with p + 2 ≤ x, from a plain list of primes.
    const primes = primesUpTo(to);
    const S = singularSeries([0, 2]).value;
    const expected: Array<{ after: bigint; before: bigint; direction: string }> = [];
    let i = 0;
    let twins = 0;
    let sign = 0;
    let lastAt = 2;
    for (let x = 2 + step; ; x = Math.min(x + step, to)) {
      while (i + 1 < primes.length && primes[i + 1]! <= x) {
        if (primes[i + 1]! - primes[i]! === 2) twins++;
        i++;
      }
      const d = twins - S * logIntegralK(2, x);
      const sg = Math.sign(d);
      if (sg !== 0) {
        if (sign !== 0 && sg !== sign) expected.push({ after: BigInt(lastAt), before: BigInt(x), direction: sg > 0 ? 'up' : 'down' });
        sign = sg;
        lastAt = x;
      }
      if (x === to) break;
    }
    expect(result.crossings).toEqual(expected);
    expect(result.crossings.length).toBeGreaterThan(0);
    expect(result.last.actual).toBe(twins);
    expect(result.samples).toBe(Math.ceil((to - 2) / step));
  });
  it('refuses too many samples and bad steps', () => {
    expect(() => hardyLittlewoodCrossings([0, 2], { to: 1e9, step: 1 })).toThrow(/samples/);
    expect(() => hardyLittlewoodCrossings([0, 2], { to: 1000, step: 0 })).toThrow(/step 0/);
    expect(() => hardyLittlewoodCrossings([0, 2, 4], { to: 1000, step: 10 })).toThrow(/not admissible/);
  });
});

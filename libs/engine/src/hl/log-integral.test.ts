import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { logIntegralK } from './log-integral';

/**
 * li(x) by Ramanujan's series (an independent method):
 * li(x) = γ + ln ln x + √x Σ_{n≥1} (−1)^(n−1) (ln x)^n / (n!·2^(n−1)) Σ_{j=0}^{⌊(n−1)/2⌋} 1/(2j+1).
 */
function liRamanujan(x: number): number {
  const gamma = 0.5772156649015329; // Euler–Mascheroni constant (OEIS A001620)
  const L = Math.log(x);
  let sum = 0;
  let term = 0;
  let inner = 0;
  for (let n = 1; n < 400; n++) {
    term = n === 1 ? L : (term * -L) / (2 * n);
    if (n % 2 === 1) inner += 1 / n;
    sum += term * inner;
  }
  return gamma + Math.log(L) + Math.sqrt(x) * sum;
}

/** ∫_a^b f by adaptive Simpson (independent quadrature, in t directly). */
function simpson(f: (t: number) => number, a: number, b: number, eps: number): number {
  const rec = (a: number, b: number, fa: number, fm: number, fb: number, whole: number, eps: number, depth: number): number => {
    const m = (a + b) / 2;
    const lm = (a + m) / 2;
    const rm = (m + b) / 2;
    const flm = f(lm);
    const frm = f(rm);
    const left = ((m - a) / 6) * (fa + 4 * flm + fm);
    const right = ((b - m) / 6) * (fm + 4 * frm + fb);
    if (depth > 40 || Math.abs(left + right - whole) <= 15 * eps) return left + right + (left + right - whole) / 15;
    return rec(a, m, fa, flm, fm, left, eps / 2, depth + 1) + rec(m, b, fm, frm, fb, right, eps / 2, depth + 1);
  };
  const fa = f(a);
  const fb = f(b);
  const fm = f((a + b) / 2);
  return rec(a, b, fa, fm, fb, ((b - a) / 6) * (fa + 4 * fm + fb), eps, 0);
}

const LI2 = 1.045163780117492784844588889194613136522615578151; // li(2), OEIS A069284

describe('Li_k(x) = ∫_2^x dt / ln^k t', () => {
  it('Li_1(x) = li(x) − li(2) against Ramanujan\'s series for li (li(2): OEIS A069284)', () => {
    for (const x of [10, 1e3, 1e6, 1e9, 1e12, 1e15]) {
      const expected = liRamanujan(x) - LI2;
      expect(Math.abs(logIntegralK(1, x) / expected - 1)).toBeLessThan(1e-13);
    }
  });
  it('li(10^9) − li(2): li(10^9) = 50849234.9570… (from memory; li(x) − π(x) = 1701 at 10^9)', () => {
    expect(logIntegralK(1, 1e9) + LI2).toBeCloseTo(50849234.957, 2);
  });
  it('satisfies the integration-by-parts recursion Li_k = (x/ln^{k−1} x − 2/ln^{k−1} 2 … ) for k ≤ 8', () => {
    // Li_{k−1}(x) = x/ln^{k−1}x − 2/ln^{k−1}2 + (k−1)·Li_k(x).
    for (const x of [100, 1e5, 1e9, 1e13]) {
      for (let k = 2; k <= 8; k++) {
        const lhs = logIntegralK(k - 1, x);
        const rhs = x / Math.log(x) ** (k - 1) - 2 / Math.LN2 ** (k - 1) + (k - 1) * logIntegralK(k, x);
        expect(Math.abs(lhs / rhs - 1)).toBeLessThan(1e-13);
      }
    }
  });
  it('agrees with adaptive Simpson in t for k = 2 … 6', () => {
    for (const x of [50, 1e4, 1e6]) {
      for (let k = 2; k <= 6; k++) {
        const ref = simpson((t) => 1 / Math.log(t) ** k, 2, x, 1e-10);
        expect(Math.abs(logIntegralK(k, x) / ref - 1)).toBeLessThan(1e-9);
      }
    }
  });
  it('is 0 at x = 2 and rejects x < 2 or a bad k', () => {
    expect(logIntegralK(3, 2)).toBe(0);
    expect(() => logIntegralK(2, 1.5)).toThrow(EngineError);
    expect(() => logIntegralK(0, 10)).toThrow(/k = 0/);
    expect(() => logIntegralK(2, Number.NaN)).toThrow(EngineError);
  });
});

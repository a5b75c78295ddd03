import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { primesUpTo } from '../primes/small-primes';
import { PrimeZetaTail } from './prime-zeta';
import { singularSeries } from './singular-series';
import { ZetaAtIntegers } from './zeta';

const BITS = 160;
const toDecimal = (x: bigint, digits: number): string => {
  const scaled = (x * 10n ** BigInt(digits)) >> BigInt(BITS);
  const s = scaled.toString().padStart(digits + 1, '0');
  return `${s.slice(0, s.length - digits)}.${s.slice(s.length - digits)}`;
};

describe('ζ at integers (Borwein)', () => {
  const zeta = new ZetaAtIntegers(BITS);
  it('ζ(3) = 1.2020569031595942853997381615114499907649862923405 (Apéry\'s constant, OEIS A002117)', () => {
    expect(toDecimal(zeta.value(3), 45)).toBe('1.202056903159594285399738161511449990764986292');
  });
  it('ζ(2) = π²/6 = 1.6449340668482264364724151666460251892189499012068 (OEIS A013661)', () => {
    expect(toDecimal(zeta.value(2), 45)).toBe('1.644934066848226436472415166646025189218949901');
  });
  it('ζ(4) = π⁴/90 and ζ(6) = π⁶/945 (doubles)', () => {
    expect(Number(zeta.value(4) >> BigInt(BITS - 52)) / 2 ** 52).toBeCloseTo(Math.PI ** 4 / 90, 15);
    expect(Number(zeta.value(6) >> BigInt(BITS - 52)) / 2 ** 52).toBeCloseTo(Math.PI ** 6 / 945, 15);
  });
  it('rejects s < 2', () => {
    expect(() => zeta.value(1)).toThrow(EngineError);
  });
});

describe('prime zeta tails', () => {
  it('P(2) = 0.45224742004106549850654336483224793417323134323989 (OEIS A085548, from memory)', () => {
    const P = new PrimeZetaTail(BITS, new Uint32Array(0));
    expect(toDecimal(P.value(2), 40)).toBe('0.4522474200410654985065433648322479341732');
  });
  it('P(s) = Σ_{q ≤ Q} q^(−s) + P_Q(s): the tails agree with the full values', () => {
    const full = new PrimeZetaTail(BITS, new Uint32Array(0));
    const primes = primesUpTo(1000);
    const tail = new PrimeZetaTail(BITS, primes);
    for (const s of [2, 3, 5, 8]) {
      let head = 0n;
      for (const q of primes) head += (1n << BigInt(BITS)) / BigInt(q) ** BigInt(s);
      const diff = full.value(s) - head - tail.value(s);
      expect(diff < 1n << 8n && diff > -(1n << 8n)).toBe(true);
    }
  });
});

describe('singular series S(H)', () => {
  // Twin prime constant C2 = 0.660161815846869573927812110014… (OEIS A005597); S({0,2}) = 2·C2.
  it('S({0,2}) = 2·C2 to 20 digits (OEIS A005597)', () => {
    const s = singularSeries([0, 2]);
    expect(s.decimal).toBe('1.3203236316937391479e+0'); // 2 × 0.66016181584686957392781211001 = 1.32032363169373914785…
    expect(s.value).toBe(Number('1.32032363169373914785562422002')); // the double nearest 2·C2
  });
  it('S({0}) = 1 and S is invariant under translation and reflection', () => {
    expect(singularSeries([0]).decimal).toBe('1.0000000000000000000e+0');
    expect(singularSeries([0, 2, 6]).decimal).toBe(singularSeries([0, 4, 6]).decimal);
    expect(singularSeries([10, 12, 16]).decimal).toBe(singularSeries([0, 2, 6]).decimal);
  });
  it('prime triplets: S({0,2,6}) = 2.8582485957192204… (the triplet constant, from memory)', () => {
    expect(singularSeries([0, 2, 6]).decimal.slice(0, 15)).toBe('2.8582485957192');
  });
  it('prime quadruplets: S({0,2,6,8}) = 4.1511808632374157… (the quadruplet constant, from memory)', () => {
    expect(singularSeries([0, 2, 6, 8]).decimal.slice(0, 15)).toBe('4.1511808632374');
  });
  it('does not depend on where the exact product stops and the prime-zeta tail starts', () => {
    for (const H of [[0, 2], [0, 2, 6, 8], [0, 4, 6, 10, 12, 16], [0, 2, 6, 8, 12, 18, 20, 26, 30, 32]]) {
      const a = singularSeries(H).decimal;
      expect(singularSeries(H, { finiteBound: 20_011 }).decimal).toBe(a);
      expect(singularSeries(H, { finiteBound: 4 * H.length + 40 }).decimal).toBe(a);
    }
  });
  it('agrees to 8 digits with a plain double-precision product to 10^7 and a rough tail', () => {
    // Independent path: ∏_{q ≤ 10^7} in doubles, tail ≈ exp(−(k² − k)/2 · Σ_{q > Q} q^(−2)) with
    // Σ_{q > Q} q^(−2) ≈ 1/(Q ln Q) (that estimate is off by ≈ 1/ln Q of itself: agreement to ~2·10^(−8)).
    const primes = primesUpTo(10_000_000);
    for (const H of [[0, 2], [0, 2, 6], [0, 2, 6, 8], [0, 4, 6, 10, 12, 16]]) {
      const k = H.length;
      let logS = 0;
      for (const q of primes) {
        const nu = new Set(H.map((h) => h % q)).size;
        logS += Math.log1p(-nu / q) - k * Math.log1p(-1 / q);
      }
      const Q = 10_000_000;
      logS -= ((k * k - k) / 2) * (1 / (Q * Math.log(Q)));
      expect(Math.abs(Math.exp(logS) / singularSeries(H).value - 1)).toBeLessThan(2e-8);
    }
  });
  it('refuses a non-admissible tuple and bad options', () => {
    expect(() => singularSeries([0, 2, 4])).toThrow(/not admissible.*mod 3/);
    expect(() => singularSeries([0, 2], { finiteBound: 2 })).toThrow(EngineError);
    expect(() => singularSeries([0, 2], { digits: 40 })).toThrow(/digits 40/);
  });
  it('handles a 50-tuple (a large k: S far from 1)', () => {
    // The first 50 primes above 50 are an admissible 50-tuple (none ≡ 0 mod q ≤ 50).
    const H = Array.from(primesUpTo(400)).filter((p) => p > 50).slice(0, 50);
    const s = singularSeries(H);
    expect(s.k).toBe(50);
    expect(singularSeries(H, { finiteBound: 5003 }).decimal).toBe(s.decimal);
    expect(Math.log(s.value)).toBeCloseTo(s.log, 9);
  });
});

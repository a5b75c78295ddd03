import { compareWithHardyLittlewood, hardyLittlewoodCrossings, hardyLittlewoodPrediction, logIntegralK, singularSeries } from '@cribra/engine';
import { domainError } from '../errors';
import { toReal } from '../runtime/arithmetic';
import { SiftRecord, Table, Tuple } from '../values/types';
import { argInt, argNum, argRange, argSmall, argTuple, type Builtin, compactInt, defineBuiltins } from './registry';

const hl: Builtin[] = [
  {
    name: 'singular', area: 'hardy-littlewood', minArgs: 1, maxArgs: 2,
    signature: 'singular(H) → real  |  singular(H, n) → string of n significant digits (n ≤ 30)',
    doc: 'The Hardy–Littlewood singular series S(H) = ∏_q (1 − ν_q(H)/q)(1 − 1/q)^(−k) of an admissible H.',
    example: { source: 'singular({0, 2}, 20)', result: '1.3203236316937391479' },
    call: (a, c) => {
      const h = argTuple(a, 0, c, 'singular');
      if (a.length === 1) return singularSeries(h).value;
      const digits = argSmall(a, 1, c, 'singular', 1, 30);
      return mantissaText(singularSeries(h, { digits }).decimal);
    },
  },
  {
    name: 'Li', area: 'hardy-littlewood', minArgs: 2, maxArgs: 2,
    signature: 'Li(k, x) → real', doc: 'Li_k(x) = ∫_2^x dt / ln^k t (x ≥ 2), the integral of the Hardy–Littlewood prediction (not the polylogarithm).',
    example: { source: 'Li(1, 10^6)', result: '78626.50399568208' },
    call: (a, c) => {
      const k = argSmall(a, 0, c, 'Li', 1, 10_000);
      const x = argNum(a, 1, c, 'Li');
      return logIntegralK(k, typeof x === 'bigint' ? x : toReal(x));
    },
  },
  {
    name: 'expected', area: 'hardy-littlewood', minArgs: 2, maxArgs: 2,
    signature: 'expected(H, x) → real',
    doc: 'The Hardy–Littlewood prediction S(H)·Li_k(x) of the number of n ≤ x with every n + h prime.',
    example: { source: 'expected({0, 2}, 10^6)', result: '8248.02968983081' },
    call: (a, c) => {
      const x = argInt(a, 1, c, 'expected');
      if (x < 2n) throw domainError('expected: x must be at least 2', c.argSpans[1]);
      return hardyLittlewoodPrediction(argTuple(a, 0, c, 'expected'), x).predicted;
    },
  },
  {
    name: 'hlcheck', area: 'hardy-littlewood', minArgs: 2, maxArgs: 2,
    signature: 'hlcheck(H, x) → record (pattern, x, constant, expected, actual, difference, ratio)',
    doc: 'The prediction S(H)·Li_k(x) beside the actual count of n ≥ 0 with every n + h prime and n + max H ≤ x.',
    example: { source: 'hlcheck({0, 2}, 10^6).actual', result: '8169' },
    call: (a, c) => {
      const x = argInt(a, 1, c, 'hlcheck');
      if (x < 2n) throw domainError('hlcheck: x must be at least 2', c.argSpans[1]);
      const h = argTuple(a, 0, c, 'hlcheck');
      const work = c.work(`sieving 0 … ${compactInt(x)} for {${h.join(', ')}}`);
      work.onProgress?.(0);
      const r = compareWithHardyLittlewood(h, x, work);
      return SiftRecord.of([
        ['pattern', new Tuple(r.pattern.map(BigInt))], ['x', r.x], ['constant', r.constant], ['expected', r.predicted],
        ['actual', BigInt(r.actual)], ['difference', r.difference], ['ratio', r.ratio],
      ]);
    },
  },
  {
    name: 'crossings', area: 'hardy-littlewood', minArgs: 3, maxArgs: 3,
    signature: 'crossings(H, a..b, step) → record (pattern, samples, crossings, lastx, actual, expected)',
    doc: 'Sign changes of actual − S(H)·Li_k(x) sampled at x = a + step, a + 2·step, …, b; crossings is a table (after, before, direction).',
    example: { source: 'crossings({0, 2}, 2..10^5, 100).samples', result: '1000' },
    call: (a, c) => {
      const r = argRange(a, 1, c, 'crossings');
      const step = argInt(a, 2, c, 'crossings');
      const h = argTuple(a, 0, c, 'crossings');
      const work = c.work(`sieving 0 … ${compactInt(r.hi)} for {${h.join(', ')}}, sampling every ${compactInt(step)}`);
      work.onProgress?.(0);
      const x = hardyLittlewoodCrossings(h, { from: r.lo, to: r.hi, step, ...work });
      return SiftRecord.of([
        ['pattern', new Tuple(x.pattern.map(BigInt))], ['samples', BigInt(x.samples)],
        ['crossings', new Table(['after', 'before', 'direction'], x.crossings.map((k) => [k.after, k.before, k.direction]))],
        ['lastx', x.last.x], ['actual', BigInt(x.last.actual)], ['expected', x.last.predicted],
      ]);
    },
  },
];

/** "1.3203236316937391478e+0" → "1.3203236316937391478" (the exponent kept when it is not 0). */
function mantissaText(decimal: string): string {
  const m = /^(.*)e([+-]?\d+)$/.exec(decimal);
  if (!m) return decimal;
  return Number(m[2]) === 0 ? m[1]! : `${m[1]}·10^${Number(m[2])}`;
}

defineBuiltins(hl);

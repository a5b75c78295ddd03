import { evaluateClosedForm, fitProductBasis, histogramByCounts, occurrenceCount, patternClosedForm, patternCount, type ClosedForm } from '@cribra/engine';
import { domainError, typeError } from '../errors';
import { Rational } from '../values/rational';
import { SiftRecord, Table, type Value } from '../values/types';
import { argInt, argSeries, argSmall, argTable, argTuple, type Builtin, type CallContext, defineBuiltins } from './registry';

/** A gap g or a consecutive gap pattern [g1, g2, …] as plain numbers. */
function patternArg(a: Value[], i: number, c: CallContext, fn: string): number[] {
  const v = a[i]!;
  const list = typeof v === 'bigint' ? [v] : argSeries(a, i, c, fn);
  return list.map((g) => {
    if (typeof g !== 'bigint') throw typeError(`${fn}: a gap pattern is a list of integers`, c.argSpans[i]);
    if (g <= 0n || g > 1000n) throw domainError(`${fn}: gaps must lie in 1..1000, got ${g}`, c.argSpans[i]);
    return Number(g);
  });
}

function levelArg(a: Value[], i: number, c: CallContext, fn: string): number {
  return argSmall(a, i, c, fn, 2, 1_000_000);
}

function formRecord(f: ClosedForm): SiftRecord {
  return SiftRecord.of([
    ['pattern', f.pattern.map((g) => BigInt(g))],
    ['formula', f.text],
    ['from', BigInt(f.from)],
    ['validfrom', BigInt(f.validFrom)],
    ['terms', new Table(['coefficient', 'shift'], f.terms.map((t) => [t.coefficient, BigInt(t.shift)]))],
    ['range', f.range],
  ]);
}

const counts: Builtin[] = [
  {
    name: 'hits', area: 'counts', minArgs: 2, maxArgs: 2,
    signature: 'hits(H, p) → integer',
    doc: 'The hits of the tuple H in one period of level p: the x in [1, p#] with every x + h coprime to p#, = ∏_{q ≤ p}(q − ν_q(H)).',
    example: { source: 'hits({0, 2}, 7)', result: '15' },
    call: (a, c) => occurrenceCount(argTuple(a, 0, c, 'hits'), levelArg(a, 1, c, 'hits')),
  },
  {
    name: 'patterncount', area: 'counts', minArgs: 2, maxArgs: 2,
    signature: 'patterncount(g or [g1, g2, …], p) → integer',
    doc: 'Exact number of runs of consecutive gaps equal to the pattern in one period of level p, by inclusion–exclusion (any level p ≤ 10^6).',
    example: { source: 'patterncount(6, 29)', result: '280323050' },
    call: (a, c) => patternCount(patternArg(a, 0, c, 'patterncount'), levelArg(a, 1, c, 'patterncount')),
  },
  {
    name: 'gapsbycounts', area: 'counts', minArgs: 1, maxArgs: 1,
    signature: 'gapsbycounts(p) → table (gap, count)',
    doc: 'The gap histogram of level p from the inclusion–exclusion counts alone (no enumeration; checked to sum to φ(p#) and p#): a second path beside gaps(p), practical to level 37.',
    example: { source: 'gapsbycounts(7)', result: 'table (gap, count): (2, 15), (4, 15), (6, 14), (8, 2), (10, 2)' },
    call: (a, c) => {
      const p = levelArg(a, 0, c, 'gapsbycounts');
      c.progress(0, `counting the gaps of level ${p}`);
      return new Table(['gap', 'count'], [...histogramByCounts(p)].sort((x, y) => x[0] - y[0]).map(([g, n]) => [BigInt(g), n]));
    },
  },
  {
    name: 'closedform', area: 'counts', minArgs: 1, maxArgs: 2,
    signature: 'closedform(g or [g1, …]) → record (pattern, formula, from, validfrom, terms, range)  |  closedform(g, p) → integer',
    doc: 'The count of a consecutive gap (pattern) as Σ c·∏_{from ≤ q ≤ p}(q − s); with a level p, its value there.',
    example: { source: 'closedform(6).formula', result: '2·∏(q−2) − 2·∏(q−3)' },
    call: (a, c) => {
      const form = patternClosedForm(patternArg(a, 0, c, 'closedform'));
      if (a.length === 1) return formRecord(form);
      return evaluateClosedForm(form, levelArg(a, 1, c, 'closedform'));
    },
  },
  {
    name: 'basisfit', area: 'fit', minArgs: 2, maxArgs: 3,
    signature: 'basisfit(T, shifts[, from]) → record (formula, coefficients, integral, fitted, holds, firstfailure, range)',
    doc: 'Fits the values (second column of T) at the levels (first column) exactly to Σ c_s·∏_{from ≤ q ≤ p}(q − s); the first |shifts| levels fix c, the rest are checked.',
    example: { source: 'basisfit(table[p ∈ primes 5..23](level: p, n: gapcount(6, p)), [2, 3], 5).formula', result: '2·∏(q−2) − 2·∏(q−3)' },
    call: (a, c) => {
      const t = argTable(a, 0, c, 'basisfit');
      if (t.columns.length < 2) throw typeError('basisfit: the table needs a level column and a value column', c.argSpans[0]);
      const series = t.rows.map((r, i) => {
        const [lv, v] = [r[0]!, r[1]!];
        if (typeof lv !== 'bigint' || typeof v !== 'bigint') throw typeError(`basisfit: row ${i + 1} must hold an integer level and an integer value`, c.argSpans[0]);
        return { level: Number(lv), value: v };
      });
      const shifts = argSeries(a, 1, c, 'basisfit').map((s) => Number(argInt([s], 0, c, 'basisfit shifts')));
      const from = a.length === 3 ? levelArg(a, 2, c, 'basisfit') : series[0]?.level ?? 2;
      const fit = fitProductBasis(series, { from, shifts });
      return SiftRecord.of([
        ['formula', fit.text],
        ['coefficients', fit.coefficients.map((r) => Rational.of(r.num, r.den))],
        ['integral', fit.integral],
        ['fitted', fit.fittedLevels.map((l) => BigInt(l))],
        ['holds', fit.holdsAt.map((l) => BigInt(l))],
        ['firstfailure', fit.firstFailure === null ? false : BigInt(fit.firstFailure)],
        ['range', fit.range],
      ]);
    },
  },
];

defineBuiltins(counts);

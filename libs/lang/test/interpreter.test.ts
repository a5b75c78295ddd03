import { describe, expect, it } from 'vitest';
import type { TableOutput, VerdictOutput } from '../src';
import { failure, run, value } from './helpers';

describe('exact arithmetic', () => {
  it.each([
    ['1 + 2 * 3', '7'],
    ['2^64', '18446744073709551616'],
    ['7/21 + 1/3', '2/3'],
    ['6/3', '2'],
    ['2^-3', '1/8'],
    ['(1/2)^2', '1/4'],
    ['-2^2', '-4'],
    ['-7 mod 3', '2'],
    ['-7 div 2', '-4'],
    ['0.1 + 0.2', '3/10'],
    ['1.5e3', '1500'],
    ['real(1)/3', '0.3333333333333333'],
    ['13#', '30030'], // 13# = 30030 (OEIS A002110)
    ['10!', '3628800'], // 10! (OEIS A000142)
    ['2 < 3 < 4', 'true'],
    ['2 < 3 > 4', 'false'],
    ['1/3 = 2/6', 'true'],
    ['1/3 ≈ real(1)/3', 'true'],
    ['5 ∈ primes 1..10', 'true'],
    ['9 ∈ primes 1..10', 'false'],
    ['4 in {0, 2, 4}', 'true'],
    ['if 2 > 1 then "yes" else "no"', 'yes'],
    ['not (1 = 1) or 2 = 2', 'true'],
  ])('%s = %s', (src, want) => {
    expect(value(src)).toBe(want);
  });

  it('shows rationals to the asked digits, exactly truncated', () => {
    expect(value('show 1/7 digits 20')).toBe('0.14285714285714285714…');
    expect(value('show 1/4 digits 20')).toBe('0.25');
  });
});

describe('collections, comprehensions and functions', () => {
  it('builds series, tuples (sets) and tables', () => {
    expect(value('[p^2 : p ∈ primes 2..12]')).toBe('[4, 9, 25, 49, 121]');
    expect(value('{h mod 6 : h ∈ 0..20}')).toBe('{0, 1, 2, 3, 4, 5}');
    expect(value('[h : h ∈ 0..30, h mod 6 = 0, h > 0]')).toBe('[6, 12, 18, 24, 30]');
    expect(value('[(a, b) : a ∈ 1..2, b ∈ 1..2]'.replace('(a, b)', '[a, b]'))).toBe('[[1, 1], [1, 2], [2, 1], [2, 2]]');
    const t = run('table[p ∈ primes 2..7](p: p, sq: p^2)').outputs[0] as TableOutput;
    expect(t).toMatchObject({ kind: 'table', columns: ['p', 'sq'] });
    expect(t.rows.map((r) => r.map((c) => (c as { v: string }).v))).toEqual([['2', '4'], ['3', '9'], ['5', '25'], ['7', '49']]);
  });

  it('evaluates big operators exactly', () => {
    expect(value('∑[n ∈ 1..10] 1/n')).toBe('7381/2520'); // H_10: numerator OEIS A001008, denominator A002805
    expect(value('∏[q ∈ primes 5..11](q − 2)')).toBe('135');
    expect(value('#[p ∈ primes 1..100] p mod 4 = 1')).toBe('11');
    expect(value('∀[p ∈ primes 3..100] p mod 2 = 1')).toBe('true');
    expect(value('∃[n ∈ 1..10] n^2 = 49')).toBe('true');
    expect(value('∑[n ∈ 1..0] n')).toBe('0');
  });

  it('indexes from 1 and reads fields and columns', () => {
    expect(value('[10, 20, 30][2]')).toBe('20');
    expect(value('{0, 2, 6}[3]')).toBe('6');
    expect(value('(a: 1, b: 2).b')).toBe('2');
    expect(value('(a: 1, b: 2)["a"]')).toBe('1');
    expect(value('table[n ∈ 1..3](n: n, c: n^3).c')).toBe('[1, 8, 27]');
    expect(value('table[n ∈ 1..3](n: n, c: n^3)[2]')).toBe('(n: 2, c: 8)');
  });

  it('runs user functions, which see only earlier names (no recursion)', () => {
    expect(value('let a = 3\nlet f(x) = a·x + 1\nf(f(2))')).toBe('22');
    expect(failure('let f(x) = f(x)\nf(1)')).toMatchObject({ kind: 'type', message: "unknown function 'f'" });
    expect(failure('let f(x) = x\nf')).toMatchObject({ kind: 'type', line: 2 });
  });

  it('refuses to rebind a builtin or a name', () => {
    expect(failure('let gaps = 3')).toMatchObject({ kind: 'type', message: "'gaps' is the name of a builtin; choose another name" });
    expect(failure('let x = 1\nlet x = 2')).toMatchObject({ kind: 'type', line: 2 });
  });
});

describe('typed errors with positions', () => {
  it.each([
    ['1 + "a"', 'type', 1, 3],
    ['unknown + 1', 'type', 1, 1],
    ['1/0', 'domain', 1, 2],
    ['{0, 2, 2}', 'domain', 1, 1],
    ['[1, 2][5]', 'domain', 1, 1],
    ['gapcount(6, 8)', 'domain', 1, 1],
    ['admissible(3)', 'type', 1, 12],
    ['gapcount(1)', 'type', 1, 1],
    ['let x = 1\n  x + true', 'type', 2, 5],
  ])('%s → %s error at %i:%i', (src, kind, line, column) => {
    expect(failure(src)).toMatchObject({ kind, line, column });
  });

  it('names the wrong argument of a builtin', () => {
    expect(failure('witness({0, 2, 4})').message).toBe('witness: the tuple is not admissible (it covers every class mod 3)');
    expect(failure('occupancy({0, 2}, "x")').message).toBe('occupancy: argument 2 must be an integer, got string');
  });

  it('keeps the outputs made before an error', () => {
    const r = (() => {
      const res = run('show 1');
      return res;
    })();
    expect(r.outputs).toHaveLength(1);
  });
});

describe('claims', () => {
  const verdict = (src: string) => run(src).outputs.find((o) => o.kind === 'verdict') as VerdictOutput;

  it('holds with exactly what was checked', () => {
    const v = verdict('claim odd: p mod 2 = 1 over p ∈ primes 3..50');
    expect(v).toMatchObject({ holds: true, label: 'odd', over: 'p ∈ primes 3..50', checked: 14, skipped: 0, counterexample: null });
    expect(v.first).toEqual([['p', { t: 'int', v: '3' }]]);
    expect(v.last).toEqual([['p', { t: 'int', v: '47' }]]);
    expect(v.summary).toContain('not a proof');
  });

  it('fails with the first counterexample and both sides', () => {
    const v = verdict('claim euler: isprime(n^2 + n + 41) = true over n ∈ 0..100');
    expect(v.holds).toBe(false);
    expect(v.checked).toBe(41);
    expect(v.counterexample).toEqual({ binding: [['n', { t: 'int', v: '40' }]], relation: '=', lhs: { t: 'bool', v: false }, rhs: { t: 'bool', v: true } });
  });

  it('says which condition failed and keeps the quantifier text as written', () => {
    const v = verdict('claim "over the top": isprime(n^2 + n + 41) over n ∈ 0..100, n ≠ 7');
    expect(v).toMatchObject({ label: 'over the top', over: 'n ∈ 0..100, n ≠ 7', checked: 40, skipped: 1 });
    expect(v.summary).toBe('fails at n = 40: the condition is false');
  });

  it('counts cases left out by conditions', () => {
    const v = verdict('claim admissible({0, h}) over h ∈ 1..20, h mod 2 = 0');
    expect(v).toMatchObject({ holds: true, checked: 10, skipped: 10 });
  });

  it('reports the failing link of a chained comparison', () => {
    const v = verdict('claim 0 < n < 5 over n ∈ 1..9');
    expect(v.counterexample).toMatchObject({ binding: [['n', { t: 'int', v: '5' }]], relation: '<', lhs: { t: 'int', v: '5' }, rhs: { t: 'int', v: '5' } });
  });

  it('checks a closed claim once', () => {
    expect(verdict('claim 7# = 210')).toMatchObject({ holds: true, checked: 1, over: null });
  });

  it('needs a condition', () => {
    expect(failure('claim 1 + 1')).toMatchObject({ kind: 'type' });
  });

  // OEIS A271564: number of gaps of 6 in the reduced residue system mod p#; its closed form
  // 2·∏(q−2) − 2·∏(q−3) over primes 5 ≤ q ≤ p is checked against the enumerated histograms.
  it('the gap-6 count equals 2∏(q−2) − 2∏(q−3) over levels 5..29 (OEIS A271564)', () => {
    const v = verdict('claim sixes: gapcount(6, p) = 2·∏[q ∈ primes 5..p](q − 2) − 2·∏[q ∈ primes 5..p](q − 3) over p ∈ primes 5..29');
    expect(v).toMatchObject({ holds: true, checked: 8 });
    expect(v.last).toEqual([['p', { t: 'int', v: '29' }]]);
  });

  it('a wrong variant fails at the first level, with both sides', () => {
    const v = verdict('claim gapcount(6, p) = 2·∏[q ∈ primes 5..p](q − 2) − 2·∏[q ∈ primes 5..p](q − 4) over p ∈ primes 5..29');
    expect(v.holds).toBe(false);
    expect(v.checked).toBe(1);
    expect(v.counterexample).toEqual({ binding: [['p', { t: 'int', v: '5' }]], relation: '=', lhs: { t: 'int', v: '2' }, rhs: { t: 'int', v: '4' } });
    expect(v.summary).toBe('fails at p = 5: 2 = 4 is false');
  });
});

describe('display directives', () => {
  it('show gives a labelled value with exact digits; strings become text', () => {
    expect(run('show 2^100 as "big"').outputs[0]).toEqual({ kind: 'value', label: 'big', value: { t: 'int', v: '1267650600228229401496703205376' }, text: '1267650600228229401496703205376' });
    expect(run('"hello"').outputs[0]).toEqual({ kind: 'text', text: 'hello' });
    expect(run('show sqrt(2) digits 5').outputs[0]).toMatchObject({ text: '1.4142' }); // √2 = 1.41421… (OEIS A002193)
  });

  it('draw gives a chart specification with series, axes and log scales', () => {
    const o = run('draw scatter table[n ∈ 1..3](n: n, sq: n^2, cube: n^3): n -> sq, cube log xy as "powers"').outputs[0];
    expect(o).toEqual({
      kind: 'chart', chart: 'scatter', title: 'powers',
      x: { label: 'n', log: true }, y: { label: 'sq, cube', log: true },
      series: [
        { name: 'sq', points: [[1, 1], [2, 4], [3, 9]] },
        { name: 'cube', points: [[1, 1], [2, 8], [3, 27]] },
      ],
    });
  });

  it('draw names a missing column', () => {
    expect(failure('draw line table[n ∈ 1..3](n: n): n -> m').message).toBe("the table has no column 'm' (columns: n)");
  });
});

import { describe, expect, it } from 'vitest';
import { evaluate, valueJsonText, type ValueJson } from '@cribra/lang';

describe('valueJsonText', () => {
  it('writes values in Sift notation', () => {
    const record: ValueJson = {
      t: 'record',
      v: [
        ['h', { t: 'tuple', v: ['0', '2', '6'] }],
        ['r', { t: 'range', lo: '5', hi: '37', primes: true }],
        ['s', { t: 'series', v: [{ t: 'rat', v: '7381/2520' }, { t: 'str', v: 'a"b' }] }],
      ],
    };
    expect(valueJsonText(record)).toBe('(h: {0, 2, 6}, r: primes 5..37, s: [7381/2520, a"b])');
    expect(valueJsonText(record, { quoteStrings: true })).toBe('(h: {0, 2, 6}, r: primes 5..37, s: [7381/2520, "a\\"b"])');
  });

  it('rewrites every integer, numerators and denominators included, with formatInteger', () => {
    const mark = (d: string) => `<${d}>`;
    expect(valueJsonText({ t: 'rat', v: '-12/35' }, { formatInteger: mark })).toBe('<-12>/<35>');
    expect(valueJsonText({ t: 'tuple', v: ['0', '10'] }, { formatInteger: mark })).toBe('{<0>, <10>}');
    expect(valueJsonText({ t: 'table', columns: ['p'], rows: [[{ t: 'int', v: '2' }]] })).toBe('table(p; 1 row)');
  });

  it('is what a failing claim shows for its counterexample', () => {
    const r = evaluate('claim c: {0, n} = {0, 2} over n ∈ 2..3');
    expect(r.ok).toBe(true);
    const verdict = r.outputs.find((o) => o.kind === 'verdict');
    expect(JSON.stringify(verdict)).toContain('{0, 3} = {0, 2} is false');
  });
});

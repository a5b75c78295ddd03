import { describe, expect, it } from 'vitest';
import type { ValueJson } from './sift-output';
import { bindingText, compareValues, valueText } from './value-text';

describe('valueText', () => {
  it.each<[ValueJson, string, string]>([
    // 29# = 6469693230 (OEIS A002110)
    [{ t: 'int', v: '6469693230' }, '6 469 693 230', '6469693230'],
    [{ t: 'int', v: '-1000' }, '-1 000', '-1000'],
    [{ t: 'rat', v: '12345/1000' }, '12 345/1 000', '12345/1000'],
    [{ t: 'real', v: 1.3203236316 }, '1.3203236316', '1.3203236316'],
    [{ t: 'real', v: 'Infinity' }, 'Infinity', 'Infinity'],
    [{ t: 'bool', v: true }, 'true', 'true'],
    [{ t: 'tuple', v: ['0', '2', '6', '8'] }, '{0, 2, 6, 8}', '{0, 2, 6, 8}'],
    [{ t: 'range', lo: '5', hi: '10000', primes: true }, 'primes 5..10 000', 'primes 5..10000'],
    [{ t: 'series', v: [{ t: 'int', v: '1' }, { t: 'int', v: '2000' }] }, '[1, 2 000]', '[1, 2000]'],
    [{ t: 'record', v: [['gap', { t: 'int', v: '4' }], ['ok', { t: 'bool', v: false }]] }, '(gap: 4, ok: false)', '(gap: 4, ok: false)'],
    [{ t: 'table', columns: ['p', 'gap'], rows: [[], []] }, 'table(p, gap; 2 rows)', 'table(p, gap; 2 rows)'],
  ])('%j', (value, display, exact) => {
    expect(valueText(value).replaceAll('\u2009', ' ')).toBe(display);
    expect(valueText(value, { grouped: false })).toBe(exact);
  });

  it('writes a binding as name = value', () => {
    expect(bindingText([['p', { t: 'int', v: '7' }], ['h', { t: 'tuple', v: ['0', '2'] }]])).toBe('p = 7, h = {0, 2}');
  });
});

describe('compareValues', () => {
  it('orders integers beyond 2^53 exactly', () => {
    const a: ValueJson = { t: 'int', v: '9007199254740993' };
    const b: ValueJson = { t: 'int', v: '9007199254740992' };
    expect(compareValues(a, b)).toBe(1);
    expect(compareValues(b, a)).toBe(-1);
    expect(compareValues(a, a)).toBe(0);
  });
  it('orders integers numerically, not as text', () => {
    expect(compareValues({ t: 'int', v: '9' }, { t: 'int', v: '10' })).toBe(-1);
  });
});

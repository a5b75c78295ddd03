import { describe, expect, it } from 'vitest';
import { groupDigits, groupNumbersInText } from './format';

describe('groupDigits', () => {
  it.each([
    [0n, '0'],
    [999, '999'],
    [1000, '1 000'],
    [30030n, '30 030'],
    // 23# = 223092870 (OEIS A002110)
    [223092870n, '223 092 870'],
    [-1234567n, '-1 234 567'],
    ['12345.678', '12 345.678'],
    [2n ** 64n, '18 446 744 073 709 551 616'],
  ])('%s → %s', (value, expected) => {
    expect(groupDigits(value as bigint | number | string, ' ')).toBe(expected);
  });

  it('uses a thin space by default', () => {
    expect(groupDigits(1000)).toBe('1\u2009000');
  });

  it('leaves text that is not a number alone', () => {
    expect(groupDigits('n/a')).toBe('n/a');
  });
});

describe('groupNumbersInText', () => {
  it('groups integers from the right and fractions from the point', () => {
    // S({0, 2}) = 2·C2 ≈ 1.3203236316937391478 (twin prime constant C2, OEIS A005597) (from memory)
    expect(groupNumbersInText('1.3203236316937', ' ')).toBe('1.320 323 631 693 7');
    expect(groupNumbersInText('(count: 1393, first: 5, last: 999431)', ' ')).toBe('(count: 1 393, first: 5, last: 999 431)');
  });
  it('leaves digits inside names and short numbers alone', () => {
    expect(groupNumbersInText('p2 + x1000 = 12.5', ' ')).toBe('p2 + x1000 = 12.5');
  });
});

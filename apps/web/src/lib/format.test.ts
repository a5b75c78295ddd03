import { describe, expect, it } from 'vitest';
import { groupDigits } from './format';

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

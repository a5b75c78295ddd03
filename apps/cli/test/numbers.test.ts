import { describe, expect, it } from 'vitest';
import { CliError } from '../src/cli-error';
import { groupDigits } from '../src/format';
import { parseInteger, parseIntegerList } from '../src/numbers';
import { plainDecimal } from '../src/commands/constant';

describe('parseInteger', () => {
  it.each([
    ['1000', 1000n],
    ['1_000_000', 1_000_000n],
    ['1e9', 1_000_000_000n],
    ['3E2', 300n],
    ['10^12', 10n ** 12n],
    ['2^64', 2n ** 64n],
    ['-5', -5n],
    ['+7', 7n],
    ['0', 0n],
    ['123456789012345678901234567890', 123456789012345678901234567890n],
  ])('%s → %s', (text, value) => {
    expect(parseInteger(text, '--x')).toBe(value);
  });
  it.each(['1.5e3', '1.0', '0x10', '1e', '', '1__0', '_1', '1e-3', 'e9', '1,000', '10^'])('rejects "%s"', (text) => {
    expect(() => parseInteger(text, '--x')).toThrow(CliError);
  });
  it('lists', () => {
    expect(parseIntegerList('0, 2;6 8', '--t')).toEqual([0n, 2n, 6n, 8n]);
    expect(() => parseIntegerList(' , ', '--t')).toThrow(CliError);
  });
});

describe('formatting', () => {
  it('groups digits by thin spaces', () => {
    expect(groupDigits(1234567n)).toBe('1\u2009234\u2009567');
    expect(groupDigits(1234)).toBe('1\u2009234'); // four digits are grouped too (docs/glossary.md)
    expect(groupDigits(123)).toBe('123');
    expect(groupDigits(-98765)).toBe('-98\u2009765');
  });
  it('writes scientific decimals plainly', () => {
    expect(plainDecimal('1.3203236316937391479e+0')).toBe('1.3203236316937391479');
    expect(plainDecimal('2.5e+2')).toBe('250');
    expect(plainDecimal('4.5e-3')).toBe('0.0045');
    expect(plainDecimal('1.2e+40')).toBe('1.2e+40');
  });
});

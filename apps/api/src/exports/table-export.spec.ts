import { neutraliseFormula, toCsv } from './table-export';

describe('CSV export', () => {
  it('puts a quote before fields a spreadsheet would execute as formulas', () => {
    const csv = toCsv({
      columns: ['p', 'note'],
      rows: [
        ['=HYPERLINK("http://x","y")', '+1+1'],
        ['@SUM(A1)', '-2+3'],
        ['\tx', '=1,2'],
      ],
    });
    expect(csv).toBe(`p,note\r\n"'=HYPERLINK(""http://x"",""y"")",'+1+1\r\n'@SUM(A1),'-2+3\r\n'\tx,"'=1,2"\r\n`);
  });

  it('leaves plain numbers (negative ones too) and ordinary text as they are', () => {
    for (const s of ['-7', '+12', '-1.5', '3e10', 'twin primes', '2 = 1 + 1', '', '9007199254740993']) expect(neutraliseFormula(s)).toBe(s);
    expect(toCsv({ columns: ['d'], rows: [[-2], ['-4']] })).toBe('d\r\n-2\r\n-4\r\n');
  });
});

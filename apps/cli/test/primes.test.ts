import { describe, expect, it } from 'vitest';
import { primesUpTo } from '@cribra/engine';
import { cribra, cribraJson, expectUsageError } from './run-cli';

describe('cribra count', () => {
  it('twin pairs below 10^6: 8169 (OEIS A007508)', () => {
    expect(cribraJson('count', '--pattern', '0,2', '--to', '1e6')).toMatchObject({
      pattern: [0, 2],
      from: '0',
      to: '1000000',
      count: '8169',
      first: '3',
    });
  });
  it('prime triplets {0,2,6} up to 10^5 agree with a plain list of primes (two code paths)', () => {
    const primes = new Set(primesUpTo(100_000));
    let expected = 0;
    for (const p of primes) if (p + 6 <= 100_000 && primes.has(p + 2) && primes.has(p + 6)) expected++;
    expect(cribraJson('count', '--pattern', '0,2,6', '--to', '10^5').count).toBe(String(expected));
  });
  it('honours --from and the same count with 1 and 2 workers on a range cut into blocks', () => {
    const one = cribraJson('count', '--pattern', '0,2', '--from', '1_000_000_000', '--to', '1_030_000_000', '--workers', '1');
    const two = cribraJson('count', '--pattern', '0,2', '--from', '1_000_000_000', '--to', '1_030_000_000', '--workers', '2');
    expect(one.count).toBe(two.count);
    expect(BigInt(one.first as string)).toBeGreaterThanOrEqual(1_000_000_000n);
  });
  it('gives the same count, first and last with the WebAssembly kernel and the JavaScript sieve (--kernel)', () => {
    // 3 424 506 twin pairs below 10^9: OEIS A007508.
    const wasm = cribraJson('count', '--pattern', '0,2', '--to', '1e9', '--workers', '2', '--kernel', 'wasm');
    const js = cribraJson('count', '--pattern', '0,2', '--to', '1e9', '--workers', '2', '--kernel', 'js');
    expect(wasm).toEqual(js);
    expect(wasm.count).toBe('3424506');
  });
  it.each([
    [['--pattern', '0,2', '--to', '100', '--kernel', 'fast'], /--kernel must be auto, wasm or js/],
    [['--pattern', '0,2', '--to', '1.5e3'], /not an integer/],
    [['--pattern', '0,2', '--to', '1e16'], /above the sieve limit/],
    [['--pattern', '0,2,4', '--to', '100'], /not admissible/],
    [['--pattern', '0,2,2', '--to', '100'], /duplicate offset 2/],
    [['--pattern', '0,2', '--to', '10', '--from', '20'], /empty range/],
    [['--pattern', '0,2'], /missing --to/],
  ])('rejects %j', (args, message) => {
    expectUsageError(cribra('count', ...(args as string[])), message);
  });
});

describe('cribra maxgaps', () => {
  it('record gaps below 10^6 and their first primes (OEIS A005250, A002386)', () => {
    const r = cribraJson('maxgaps', '--to', '1e6');
    const records = r.records as Array<{ gap: number; after: string }>;
    expect(records.map((x) => x.gap)).toEqual([1, 2, 4, 6, 8, 14, 18, 20, 22, 34, 36, 44, 52, 72, 86, 96, 112, 114]);
    expect(records.map((x) => x.after)).toEqual([
      '2', '3', '7', '23', '89', '113', '523', '887', '1129', '1327', '9551', '15683', '19609', '31397', '155921',
      '360653', '370261', '492113',
    ]);
    expect(r.primes).toBe('78498'); // π(10^6), OEIS A006880
  });
  it('rejects a bad bound', () => {
    expectUsageError(cribra('maxgaps', '--to', '1e6x'), /not an integer/);
  });
});

describe('cribra dispatcher', () => {
  it('unknown subcommand: one line, exit 2', () => {
    expectUsageError(cribra('primes'), /unknown command "primes"/);
  });
  it('no subcommand: usage on stderr, exit 2', () => {
    const r = cribra();
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^usage: cribra/);
  });
  it('--help lists every subcommand, exit 0', () => {
    const r = cribra('--help');
    expect(r.code).toBe(0);
    for (const c of ['admissible', 'wheel', 'count', 'occurrences', 'gapcount', 'constant', 'narrowest', 'maxgaps', 'run']) {
      expect(r.stdout).toContain(`  ${c} `);
    }
  });
  it('subcommand --help prints its usage', () => {
    const r = cribra('count', '--help');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^usage: cribra count/);
  });
  it('stray positional argument', () => {
    expectUsageError(cribra('wheel', '--level', '7', 'extra'), /unexpected argument 'extra'/);
  });
  it('a flag missing its value', () => {
    expectUsageError(cribra('wheel', '--level'), /--level/);
  });
});

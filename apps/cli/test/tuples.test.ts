import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cribra, cribraJson, expectUsageError } from './run-cli';

const dir = mkdtempSync(join(tmpdir(), 'cribra-cli-'));
const file = (name: string, text: string) => {
  const path = join(dir, name);
  writeFileSync(path, text);
  return path;
};

describe('cribra admissible', () => {
  it('gives the witness of an admissible tuple', () => {
    // {0,2,6,8,12} misses 1 mod 2, 1 mod 3 and 4 mod 5 (hand computation: residues mod 5 are 0,2,1,3,2).
    expect(cribraJson('admissible', '--tuple', '0,2,6,8,12')).toEqual({
      k: 5,
      diameter: 12,
      admissible: true,
      witness: { 2: 1, 3: 1, 5: 4 },
    });
  });
  it('gives the obstruction of a non-admissible tuple (exit 0: it is an answer)', () => {
    expect(cribraJson('admissible', '--tuple', '0,2,4')).toEqual({
      k: 3,
      diameter: 4,
      admissible: false,
      obstruction: { prime: 3, covered: [0, 1, 2], residues: [0, 1, 2] },
    });
  });
  it('reads a file: one integer per line, blank and # lines ignored, any order, negatives', () => {
    const path = file('t.txt', '# a quadruplet\n8\n\n-4\n  2\n# end\n-2\n');
    expect(cribraJson('admissible', '--file', path)).toMatchObject({ k: 4, diameter: 12, admissible: true });
  });
  it('prints a readable form without --json', () => {
    const r = cribra('admissible', '--tuple', '0,2,6');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^admissible 3-tuple, diameter 6/);
  });
  it.each([
    [['--tuple', '0,2,2'], /duplicate offset 2/],
    [['--tuple', '0,2,x'], /"x" is not an integer/],
    [['--tuple', '0,1.5'], /"1.5" is not an integer/],
    [[], /missing --tuple/],
    [['--tuple', '0,2', '--file', '/nonexistent'], /either --tuple or --file/],
    [['--file', '/nonexistent/tuple.txt'], /cannot read/],
    [['--tuple', '0,2', '--width', '3'], /unknown flag '--width'/],
  ])('rejects %j', (args, message) => {
    expectUsageError(cribra('admissible', ...(args as string[])), message);
  });
  it('rejects a file line that is not an integer, naming the line', () => {
    expectUsageError(cribra('admissible', '--file', file('bad.txt', '0\n2\n6.0\n')), /bad\.txt:3/);
  });
});

describe('cribra narrowest', () => {
  it('H(20) = 80 with a witness tuple (OEIS A008407)', () => {
    const r = cribraJson('narrowest', '--k', '20');
    expect(r).toMatchObject({ k: 20, diameter: 80, exact: true, method: 'exhaustive' });
    const tuple = r.tuple as number[];
    expect(tuple).toHaveLength(20);
    expect(tuple[0]).toBe(0);
    expect(tuple[19]).toBe(80);
    // Independent path: the admissible subcommand agrees.
    expect(cribraJson('admissible', '--tuple', tuple.join(','))).toMatchObject({ admissible: true, diameter: 80 });
  });
  it('H(10) = 32 in human form (OEIS A008407)', () => {
    const r = cribra('narrowest', '--k', '10');
    expect(r.stdout).toMatch(/^H\(10\) = 32 \(exhaustive search\)/);
  });
  it('gives an admissible upper bound above the exact range', () => {
    const r = cribraJson('narrowest', '--k', '300');
    expect(r).toMatchObject({ k: 300, exact: false });
    expect((r.tuple as number[]).length).toBe(300);
    // 300 offsets of one parity span at least 2·299 = 598; H(300) ≤ 2000 is far above any construction here.
    expect(r.diameter as number).toBeGreaterThan(598);
    expect(r.diameter as number).toBeLessThan(2500);
  });
  it.each([['0'], ['1.5e3'], ['-3'], ['abc'], ['10^9']])('rejects --k %s', (k) => {
    expectUsageError(cribra('narrowest', '--k', k), /--k/);
  });
  it('--search on 2 workers: the old fields, the new ones, never wider than without search, admissible', () => {
    const plain = cribraJson('narrowest', '--k', '300');
    const r = cribraJson('narrowest', '--k', '300', '--search', '3', '--workers', '2');
    expect(Object.keys(r)).toEqual(expect.arrayContaining(['k', 'diameter', 'tuple', 'exact', 'method', 'witness']));
    expect(r).toMatchObject({ k: 300, exact: false, baseline: plain.diameter, searchSeconds: 3, workers: 2 });
    expect(r.pieces as number).toBeGreaterThanOrEqual(2);
    expect(r.diameter as number).toBeLessThanOrEqual(plain.diameter as number);
    const tuple = r.tuple as number[];
    expect(tuple).toHaveLength(300);
    expect(cribraJson('admissible', '--tuple', tuple.join(','))).toMatchObject({ admissible: true, diameter: r.diameter });
  });
  it('--search below k = 101 is the exact value at once', () => {
    expect(cribraJson('narrowest', '--k', '20', '--search', '5')).toMatchObject({ diameter: 80, exact: true, pieces: 0 });
  });
  it.each([['0'], ['x'], ['90000']])('rejects --search %s', (s) => {
    expectUsageError(cribra('narrowest', '--k', '300', '--search', s), /--search/);
  });
});

describe('cribra constant', () => {
  it('S({0,2}) = 2·C2 to 15 digits (C2 = 0.660161815846869573927812110014…, OEIS A005597)', () => {
    const r = cribraJson('constant', '--pattern', '0,2');
    expect(r.digits).toBe(20);
    expect((r.value as string).slice(0, 17)).toBe('1.320323631693739');
  });
  it('honours --digits', () => {
    expect(cribraJson('constant', '--pattern', '0,2', '--digits', '5').value).toBe('1.3203');
  });
  it('refuses a non-admissible pattern', () => {
    expectUsageError(cribra('constant', '--pattern', '0,2,4'), /not admissible/);
  });
  it('refuses --digits out of range', () => {
    expectUsageError(cribra('constant', '--pattern', '0,2', '--digits', '31'), /--digits/);
  });
});

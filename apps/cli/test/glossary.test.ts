import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { CLI_TERMS } from '../src/glossary';
import { cribra, cribraJson } from './run-cli';

const glossary = readFileSync(new URL('../../../docs/glossary.md', import.meta.url), 'utf8');

describe('one set of terms from cell to CLI', () => {
  it('every term the CLI explains is defined in docs/glossary.md', () => {
    expect(CLI_TERMS.length).toBeGreaterThan(5);
    for (const t of CLI_TERMS) expect(glossary, t.term).toContain(`**${t.term}**`);
  });

  it('cribra --help lists the glossary terms and every command with its glossary alias', () => {
    const help = cribra('--help').stdout;
    expect(help).toContain('Terms (docs/glossary.md):');
    for (const t of CLI_TERMS) expect(help).toMatch(new RegExp(`\\n  ${t.term} +${t.meaning.slice(0, 20).replace(/[()+.*?[\]]/g, '\\$&')}`));
    expect(help).toContain('(also: cribra hits)');
    expect(help).toContain('(also: cribra constellations)');
    expect(help).toContain('(also: cribra records)');
    expect(help).toContain('(also: cribra singular)');
    expect(help).toContain('Ranges --from A --to N include both ends.');
  });

  it('a command\'s --help explains its terms', () => {
    const help = cribra('occurrences', '--help').stdout;
    expect(help).toMatch(/^usage: cribra occurrences/);
    expect(help).toContain('also: cribra hits');
    expect(help).toContain('  hits — x in one period [1, p#]');
    expect(cribra('count', '--help').stdout).toContain('  range — --from A --to N is A..N, both ends included');
  });

  it('the glossary names run the same commands, and --tuple works wherever --pattern does', () => {
    // Twin pairs (n, n + 2) with n + 2 ≤ 10^6: 8169 (OEIS A007508)
    expect(cribraJson('constellations', '--tuple', '0,2', '--to', '1e6')).toEqual(cribraJson('count', '--pattern', '0,2', '--to', '1e6'));
    expect(cribraJson('constellations', '--tuple', '0,2', '--to', '1e6')).toMatchObject({ count: '8169' });
    // ∏_{3 ≤ q ≤ 7}(q − 2) = 1·3·5 = 15 hits of {0, 2} in one period of level 7
    expect(cribraJson('hits', '--tuple', '0,2', '--level', '7')).toEqual({ pattern: [0, 2], level: 7, count: '15' });
    expect(cribraJson('records', '--to', '1000')).toEqual(cribraJson('maxgaps', '--to', '1000'));
    expect(cribraJson('singular', '--tuple', '0,2')).toMatchObject({ value: '1.3203236316937391479' }); // 2C₂ (OEIS A114907)
    const both = cribra('count', '--tuple', '0,2', '--pattern', '0,2', '--to', '100');
    expect(both.code).toBe(2);
    expect(both.stderr).toMatch(/give either --pattern or --tuple/);
  });

  it('the obstruction gives its classes as residues (covered is kept)', () => {
    expect(cribraJson('admissible', '--tuple', '0,2,4')).toMatchObject({ obstruction: { prime: 3, covered: [0, 1, 2], residues: [0, 1, 2] } });
  });

  it('readable output: Sift notation, ranges a..b, digits grouped from four digits on', () => {
    expect(cribra('admissible', '--tuple', '0,2,4').stdout).toContain('residues {0, 1, 2}');
    const count = cribra('count', '--tuple', '0,2', '--to', '1e6').stdout;
    expect(count).toContain('tuple {0, 2} in 0..1\u2009000\u2009000: 8\u2009169 constellations');
    expect(cribra('wheel', '--level', '13').stdout).toContain('members φ(13#) = 5\u2009760'); // φ(13#) = 5760 (OEIS A005867)
    expect(cribra('narrowest', '--k', '5').stdout).toContain('tuple: {0, 2, 6, 8, 12}'); // H(5) = 12
  });
});

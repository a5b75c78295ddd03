import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { runCommand } from '../src/commands/run';

const dir = mkdtempSync(path.join(tmpdir(), 'cribra-run-'));
const file = (name: string, text: string) => {
  const p = path.join(dir, name);
  writeFileSync(p, text);
  return p;
};

async function cli(argv: string[]) {
  let out = '';
  let err = '';
  const code = await runCommand(argv, (s) => (out += s), (s) => (err += s));
  return { code, out, err };
}

describe('cribra run', () => {
  it('runs query and claim cells and exits 0 when every claim holds', async () => {
    const f = file('ok.sift', '@@@ title: Small\n@@ note\nJust text.\n@@ query\nshow 7# as "p7"\n@@ claim\nclaim p mod 2 = 1 over p ∈ primes 3..50\n');
    const r = await cli([f, '--workers', '1']);
    expect(r.code).toBe(0);
    expect(r.out).toContain('p7 = 210');
    expect(r.out).toContain('HOLDS: holds for every p ∈ primes 3..50 (14 cases, every case checked)\n'); // 14 odd primes ≤ 50
    expect(r.out).toContain('claims: 1 hold, 0 fail; cell errors: 0');
  });

  it('exits 1 when a claim fails, with JSON output for machines', async () => {
    const f = file('fail.sift', '@@ claim\nclaim isprime(n^2 + n + 41) over n ∈ 0..50\n');
    const r = await cli([f, '--json', '--workers', '1']);
    expect(r.code).toBe(1);
    const j = JSON.parse(r.out);
    expect(j.claims).toEqual({ holds: 0, fails: 1 });
    expect(j.cells[0].outputs[0]).toMatchObject({ kind: 'verdict', holds: false, counterexample: { binding: [['n', { t: 'int', v: '40' }]] } });
    expect(j.cells[0].digest).toMatch(/^[0-9a-f]{64}$/);
  });

  it('exits 2 on a cell error and names the file line', async () => {
    const f = file('err.sift', '@@ query\nshow 1\nshow 1/0\n');
    const r = await cli([f, '--workers', '1']);
    expect(r.code).toBe(2);
    expect(r.out).toContain('Domain error at line 3, column 7: division by zero');
  });

  it('introduces a builtin\'s error by its kind and reports every syntax error of a cell', async () => {
    const f = file('slips.sift', '@@ query\nprimebefore(2)\n@@ query\nlet x = 1 +\nshow (2\nclaim x = over p ∈ 1..3\n');
    const r = await cli([f, '--workers', '1']);
    expect(r.code).toBe(2);
    expect(r.out).toContain('Domain error at line 2, column 1: primebefore: there is no prime below 2');
    const syntax = r.out.split('\n').filter((l) => l.trim().startsWith('Syntax error'));
    expect(syntax.map((l) => l.trim().replace(/:.*/, ''))).toEqual([
      'Syntax error at line 4, column 12', 'Syntax error at line 5, column 6', 'Syntax error at line 5, column 8', 'Syntax error at line 6, column 11',
    ]);
  });

  it('a verdict whose note claims more says the broader statement is not established', async () => {
    const f = file('broad.sift', '@@ note\nThe six-gap formula holds for all p ≥ 5.\n@@ claim\nclaim sixes: gapcount(6, p) = closedform(6, p) over p ∈ primes 5..19\n');
    const r = await cli([f, '--workers', '1']);
    expect(r.code).toBe(0);
    expect(r.out).toContain('HOLDS [sixes]: holds for every p ∈ primes 5..19 (6 cases, every case checked); a note states more than this range, and that broader statement is not established\n');
  });

  it('exits 2 with one line for a missing file, a bad marker or a bad option', async () => {
    expect(await cli([path.join(dir, 'none.sift')])).toMatchObject({ code: 2, err: expect.stringMatching(/^cannot read .*none\.sift: ENOENT\n$/) });
    const bad = file('bad.sift', '@@ sketch\n');
    expect(await cli([bad])).toMatchObject({ code: 2, err: `${bad}:1: unknown cell kind 'sketch'; a cell is query, claim or note\n` });
    expect((await cli([bad, '--frobnicate'])).err.split('\n')[0]).toBe('unknown option --frobnicate');
  });

  it('reads uploads given on the command line', async () => {
    const t = file('q.txt', '# a quintuplet\n0\n2\n6\n8\n12\n');
    const f = file('up.sift', '@@ query\nshow admissible(upload("q")) as "ok"\n');
    const r = await cli([f, '--upload', `q=${t}`, '--workers', '1']);
    expect(r.code).toBe(0);
    expect(r.out).toContain('ok = true');
  });

  it('runs the tutorial notebook: its deliberately wrong guess fails, everything else works', async () => {
    const tutorial = fileURLToPath(new URL('../../../seeds-demo/sift-tutorial.sift', import.meta.url));
    const r = await cli([tutorial, '--json', '--workers', '2']);
    const j = JSON.parse(r.out);
    expect(j.errors).toBe(0);
    expect(j.claims).toEqual({ holds: 2, fails: 1 });
    expect(r.code).toBe(1);
  });
});

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
    expect(r.out).toContain('HOLDS: holds in all 14 cases checked (p ∈ primes 3..50)');
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
    expect(r.out).toContain('error (domain) at line 3, column 7: division by zero');
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

// Sift's own names for the prime builtins, the old spellings kept hidden, and "did you mean".
import { describe, expect, it } from 'vitest';
import { allBuiltins, complete, diagnose, evaluate, hover } from '../src';
import { failure, value } from './helpers';

const RENAMED: Array<[string, string, string]> = [
  // [old spelling, new name, a cell using it]
  ['isprime', 'prime', 'show [isprime(n) : n ∈ 1..30]\nshow isprime(2^89 - 1)'],
  ['nextprime', 'primeafter', 'show nextprime(10^12)\ntable[p ∈ primes 2..50](p: p, next: nextprime(p))'],
  ['prevprime', 'primebefore', 'show prevprime(100)\nshow prevprime(2^61)'],
  ['primepi', 'primecount', 'table[k ∈ 1..6](k: k, count: primepi(10^k))\nshow [primepi(x) - π(x) : x ∈ 1..50]'],
];

describe('renamed prime builtins', () => {
  it('the new names give the published values', () => {
    expect(value('prime(2^61 - 1)')).toBe('true'); // M61 is prime (OEIS A000043 lists 61)
    expect(value('prime(2^67 - 1)')).toBe('false'); // Cole 1903: 193707721 · 761838257287
    expect(value('[primecount(10^k) : k ∈ 1..6]')).toBe('[4, 25, 168, 1229, 9592, 78498]'); // OEIS A006880
    expect(value('primeafter(10^12)')).toBe('1000000000039'); // (from memory) least prime above 10^12
    expect(value('primebefore(100)')).toBe('97');
  });

  for (const [old, now, cell] of RENAMED) {
    it(`${old} still runs and gives the same outputs and digest as ${now}`, () => {
      const before = evaluate(cell);
      const after = evaluate(cell.replaceAll(`${old}(`, `${now}(`));
      expect(before.error).toBeNull();
      expect(after.error).toBeNull();
      expect(before.outputs.length).toBeGreaterThan(0);
      expect(after.digest).toBe(before.digest);
      expect(after.outputs).toEqual(before.outputs);
    });
  }

  it('a claim written either way reaches the same verdict (only the statement as written differs)', () => {
    const old = evaluate('claim euler: isprime(n^2 + n + 41) over n ∈ 0..39').outputs[0]!;
    const now = evaluate('claim euler: prime(n^2 + n + 41) over n ∈ 0..39').outputs[0]!;
    expect({ ...now, statement: '' }).toEqual({ ...old, statement: '' });
  });

  it('keeps the digest an old cell recorded before the rename', () => {
    // Recorded with isprime/nextprime/prevprime/primepi as they were (commit ce3600f).
    expect(evaluate('claim euler: isprime(n^2 + n + 41) over n ∈ 0..39').digest).toBe(RECORDED.euler);
    expect(evaluate('show [nextprime(100), prevprime(100), primepi(1000)]').digest).toBe(RECORDED.values);
  });

  it("an old spelling's messages keep the old name (they were part of what the cell printed)", () => {
    expect(failure('prevprime(2)')).toMatchObject({ kind: 'domain', message: 'prevprime: there is no prime below 2' });
    expect(failure('primebefore(2)')).toMatchObject({ kind: 'domain', message: 'primebefore: there is no prime below 2' });
  });

  it('lists only the new names in completions and the builtin list', () => {
    const names = allBuiltins().map((b) => b.name);
    for (const [old, now] of RENAMED) {
      expect(names).toContain(now);
      expect(names).not.toContain(old);
    }
    expect(complete('show prim', 9).map((c) => c.label)).toEqual(expect.arrayContaining(['prime', 'primeafter', 'primebefore', 'primecount']));
    expect(complete('show isp', 8).map((c) => c.label)).toEqual([]);
    expect(complete('show next', 9).map((c) => c.label)).toEqual([]);
    expect(hover('isprime(7)', 1)!.contents[0]).toBe('isprime is the old spelling of prime; it still runs as before');
  });

  it('the new names do not break a cell that already used them for its own values', () => {
    expect(value('let prime = 7\nlet primecount = 4\nprime + primecount')).toBe('11');
    expect(value('[prime : prime ∈ primes 2..7]')).toBe('[2, 3, 5, 7]');
    expect(diagnose('let prime = 7\nprime')).toEqual([]);
    // older builtins are still refused as names
    expect(failure('let gaps = 1')).toMatchObject({ message: "'gaps' is the name of a builtin; choose another name" });
  });
});

describe('did you mean', () => {
  it('suggests builtins for slips and Greek letters typed by name', () => {
    expect(failure('pi(100)')).toMatchObject({ kind: 'type', message: "unknown function 'pi'; did you mean 'π'?" });
    expect(failure('gapcnt(6, 7)')).toMatchObject({ kind: 'type', message: "unknown function 'gapcnt'; did you mean 'gapcount'?" });
    expect(failure('jacobstal(13)').message).toBe("unknown function 'jacobstal'; did you mean 'jacobsthal'?");
    expect(failure('nextprim(10)').message).toBe("unknown function 'nextprim'; did you mean 'primeafter'?");
  });

  it("suggests the cell's own names", () => {
    expect(failure('let sixes = 14\nsixes + sixs').message).toBe("unknown name 'sixs'; did you mean 'sixes'?");
    expect(failure('let growth(p) = p - 1\ngrowht(5)').message).toBe("unknown function 'growht'; did you mean 'growth'?");
    expect(diagnose('let sixes = 14\nsixs').map((d) => d.message)).toEqual(["unknown name 'sixs'; did you mean 'sixes'?"]);
    expect(diagnose('pi(10)').map((d) => d.message)).toEqual(["unknown function 'pi'; did you mean 'π'?"]);
  });

  it('says nothing when nothing is close (one-letter names included)', () => {
    expect(failure('q + 1').message).toBe("unknown name 'q'");
    expect(failure('frobnicate(2)').message).toBe("unknown function 'frobnicate'");
  });
});

describe('all syntax errors of a run', () => {
  it('a run reports every syntax error the editor shows, in its error and diagnostics', () => {
    const src = 'let x = 1 +\nshow (2\nclaim x = over p ∈ 1..3';
    const r = evaluate(src);
    const editor = diagnose(src).filter((d) => d.kind === 'syntax');
    expect(editor.length).toBe(4);
    expect(r.diagnostics.map((d) => [d.line, d.column, d.message])).toEqual(editor.map((d) => [d.line, d.column, d.message]));
    expect(r.error).toMatchObject({ kind: 'syntax', line: 1 });
    expect(r.error!.message).toContain('(and 3 more syntax errors, on lines 2 and 3)');
    expect(evaluate('show (1 +').error!.message).not.toContain('more syntax');
  });
});

const RECORDED = {
  euler: '2696994d257cf66b98adb9ec395300ee06fd1584e7a484756e99bfcd1fc45c26',
  values: '41bea9a15a44e5c2afbeefb5e684966e7bc8effe28e0ddc6b6254b0624a81716',
};

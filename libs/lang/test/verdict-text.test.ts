import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { evaluate, parseNotebookFile, statesMoreThanChecked, verdictSentence, type VerdictOutput } from '../src';

const verdict = (src: string) => evaluate(src).outputs.find((o) => o.kind === 'verdict') as VerdictOutput;

describe('verdict sentences say exactly what was shown', () => {
  it('a finite claim checked in every case: holds for every case of the range, said once', () => {
    // primes 5..19 = 5, 7, 11, 13, 17, 19: six levels; both sides are exact counts by two code paths
    const v = verdict('claim sixes: gapcount(6, p) = closedform(6, p) over p ∈ primes 5..19');
    const s = verdictSentence(v);
    expect(s).toBe('holds for every p ∈ primes 5..19 (6 cases, every case checked)');
    expect(s.split('5..19').length - 1).toBe(1);
    expect(s).not.toMatch(/not a proof|evidence/);
  });

  it('counts the cases the conditions left out, with the right number words', () => {
    expect(verdictSentence(verdict('claim prime(n^2 + n + 41) over n ∈ 0..39, n ≠ 7'))).toBe(
      'holds for every n ∈ 0..39, n ≠ 7 (39 cases, every case checked; 1 left out by the conditions)',
    );
    expect(verdictSentence(verdict('claim prime(p) over p ∈ primes 2..2'))).toBe('holds for every p ∈ primes 2..2 (1 case, checked)');
    expect(verdictSentence(verdict('claim prime(p) over p ∈ primes 2..200000'))).toBe('holds for every p ∈ primes 2..200000 (17\u2009984 cases, every case checked)'); // π(2·10^5) = 17984 (OEIS A000720)
  });

  it('a claim without over: checked once, no empty range', () => {
    const s = verdictSentence(verdict('claim 7# = 210'));
    expect(s).toBe('holds (a statement without a range, checked once)');
    expect(s).not.toMatch(/from|cases/);
  });

  it('where the name or a note states more than the range, says the broader statement is not established', () => {
    const v = verdict('claim "six-gap formula for every level": gapcount(6, p) = closedform(6, p) over p ∈ primes 5..19');
    expect(verdictSentence(v)).toBe(
      "holds for every p ∈ primes 5..19 (6 cases, every case checked); the claim's name states more than this range, and that broader statement is not established",
    );
    const plain = verdict('claim sixes: gapcount(6, p) = closedform(6, p) over p ∈ primes 5..19');
    expect(verdictSentence(plain, { notes: ['The formula holds for all p ≥ 5.'] })).toBe(
      'holds for every p ∈ primes 5..19 (6 cases, every case checked); a note states more than this range, and that broader statement is not established',
    );
    expect(verdictSentence(plain, { title: 'Always true?', notes: ['It holds for all p.'] })).toMatch(/; the claim's name and a note state more than this range/);
  });

  it('fails: the first counterexample, unchanged', () => {
    const v = verdict('claim linear: jacobsthal(p) < p + 10 over p ∈ primes 3..23');
    expect(verdictSentence(v)).toBe(v.summary);
    expect(v.summary).toMatch(/^fails at p = /);
  });

  it('reads the demo notes as a number theorist would', () => {
    expect(statesMoreThanChecked('Every number below is an exact count over a full period', ['p'])).toBe(false);
    expect(statesMoreThanChecked('the claim is settled for 10-tuples; exhaustive for each diameter d from 9 to 31', ['d'])).toBe(false);
    expect(statesMoreThanChecked('so it holds for all p', ['p'])).toBe(true);
    expect(statesMoreThanChecked('true at every level', ['p'])).toBe(true);
    expect(statesMoreThanChecked('∀p the counts agree', ['p'])).toBe(true);
    expect(statesMoreThanChecked('there are infinitely many such primes', ['n'])).toBe(true);
    expect(statesMoreThanChecked('We checked all levels from 5 to 19. It should hold for every level.', ['p'], ['19'])).toBe(true);
    expect(statesMoreThanChecked('We checked all levels from 5 to 19.', ['p'], ['19'])).toBe(false);
    for (const name of ['narrow-ten-tuples', 'gap-patterns-across-levels', 'ledger-twins-draft']) {
      const nb = parseNotebookFile(readFileSync(new URL(`../../../seeds-demo/notebooks/${name}.sift`, import.meta.url), 'utf8')).notebook;
      const notes = nb.cells.filter((c) => c.kind === 'note').map((c) => c.source);
      for (const c of nb.cells.filter((x) => x.kind === 'claim')) {
        const v = verdict(c.source);
        if (v?.holds) expect(verdictSentence(v, { title: c.title, notes }), `${name}: ${c.title}`).not.toMatch(/not established/);
      }
    }
  });

  it("the interpreter's recorded summary is unchanged (it is part of locked notebooks' digests)", () => {
    expect(verdict('claim sixes: gapcount(6, p) = closedform(6, p) over p ∈ primes 5..19').summary).toBe(
      'holds in all 6 cases checked (p ∈ primes 5..19); computed evidence over this range, not a proof',
    );
  });
});

import { describe, expect, it } from 'vitest';
import { complete, diagnose, hover, tokenize } from '../src';

describe('tokens for highlighting', () => {
  it('classifies every token with its position', () => {
    const src = 'let H = {0, 2} // pair\nshow admissible(H) ∧';
    const toks = tokenize(src).map((t) => [src.slice(t.offset, t.offset + t.length), t.kind, t.line, t.column]);
    expect(toks).toEqual([
      ['let', 'keyword', 1, 1], ['H', 'name', 1, 5], ['=', 'operator', 1, 7], ['{', 'punctuation', 1, 9], ['0', 'number', 1, 10],
      [',', 'punctuation', 1, 11], ['2', 'number', 1, 13], ['}', 'punctuation', 1, 14], ['// pair', 'comment', 1, 16],
      ['show', 'keyword', 2, 1], ['admissible', 'builtin', 2, 6], ['(', 'punctuation', 2, 16], ['H', 'name', 2, 17],
      [')', 'punctuation', 2, 18], ['∧', 'invalid', 2, 20],
    ]);
  });

  it('marks mathematical symbols as keywords or operators', () => {
    const kinds = tokenize('∑[n ∈ 1..3] n · 2 ≠ 7#').map((t) => t.kind);
    expect(kinds).toEqual(['keyword', 'punctuation', 'name', 'keyword', 'number', 'operator', 'number', 'punctuation', 'name', 'operator', 'number', 'operator', 'number', 'operator']);
  });
});

describe('completions', () => {
  it('offers builtins with signature and doc, filtered by the word typed', () => {
    const c = complete('show gapc', 9);
    expect(c).toEqual([{ label: 'gapcount', kind: 'function', detail: 'gapcount(g, p) → integer', documentation: expect.stringContaining('gaps equal to g'), insertText: 'gapcount(' }]);
  });

  it('offers names defined in the cell and keywords', () => {
    const src = 'let level = 5\nlet f(width) = width\nle';
    const labels = complete(src, src.length).map((c) => `${c.kind}:${c.label}`);
    expect(labels).toContain('variable:level');
    expect(labels).toContain('keyword:let');
    expect(labels).toContain('function:ledger');
  });

  it('offers chart kinds after draw and axes after log', () => {
    expect(complete('draw ', 5).map((c) => c.label)).toEqual(['line', 'scatter', 'bar']);
    expect(complete('draw line T: a -> b log ', 24).map((c) => c.label)).toEqual(['x', 'y', 'xy']);
  });
});

describe('diagnostics', () => {
  it('gives every syntax error and every unknown name at once, with positions', () => {
    const d = diagnose('let x = 1 +\nshow y\nlet z = (2\nwheel(7, 8)\nnosuch(1)\nlet sum2 = x');
    expect(d.map((e) => [e.kind, e.line, e.column, e.message])).toEqual([
      ['syntax', 1, 12, 'the statement ends too early: expected a value (number, name, string, tuple {…}, series […], (…) or ∑/∏/∀/∃/#/table[…])'],
      ['type', 2, 6, "unknown name 'y'"],
      ['syntax', 3, 9, "'(' is never closed"],
      ['syntax', 4, 1, "unexpected 'wheel': expected ')'"],
      ['type', 6, 12, "unknown name 'x'"],
    ]);
    expect(diagnose('wheel(7, 8)\nnosuch(1)').map((e) => [e.line, e.message])).toEqual([
      [1, 'wheel takes 1 arguments, got 2: wheel(p) → record (level, modulus, members, maxgap)'],
      [2, "unknown function 'nosuch'"],
    ]);
  });

  it('knows binder scopes and user functions', () => {
    expect(diagnose('let f(a) = a + 1\nclaim f(p) > p over p ∈ primes 2..9\n[q^2 : q ∈ 1..3]')).toEqual([]);
    expect(diagnose('[q : r ∈ 1..3]')[0]).toMatchObject({ message: "unknown name 'q'" });
    expect(diagnose('let f(a) = a\nf(1, 2)')[0]).toMatchObject({ message: 'f takes 1 argument, got 2' });
    expect(diagnose('let gaps = 1')[0]).toMatchObject({ message: "'gaps' is the name of a builtin; choose another name" });
  });
});

describe('hover', () => {
  it('shows a builtin signature, doc and example', () => {
    const h = hover('show hits({0, 2}, 7)', 6);
    expect(h).toEqual({ contents: ['hits(H, p) → integer', expect.stringContaining('∏_{q ≤ p}(q − ν_q(H))'), 'Example: hits({0, 2}, 7)  ⟶  15'], offset: 5, length: 4 });
  });

  it('explains keywords and symbols and gives exact values of number literals', () => {
    expect(hover('∏[q ∈ primes 5..7] q', 0)!.contents[0]).toBe('∏[x ∈ domain, …] factor  |  prod(series)');
    expect(hover('x = 1e9', 5)!.contents).toEqual(['exact value 1000000000']);
    expect(hover('x = 0.125', 5)!.contents).toEqual(['exact value 1/8']);
    expect(hover('   ', 1)).toBeNull();
  });
});

import { describe, expect, it } from 'vitest';
import { parse, type Stmt } from '../src';

const kinds = (src: string) => {
  const r = parse(src);
  expect(r.errors.map((e) => e.message)).toEqual([]);
  return r.program.statements.map((s) => s.t);
};

describe('Sift grammar: valid programs', () => {
  it('parses every statement form', () => {
    expect(kinds(`let H = {0, 2, 6, 8}
let f(x, y) = x^2 + y
claim sixes: gapcount(6, p) = 2·∏[q ∈ primes 5..p](q − 2) − 2·∏[q ∈ primes 5..p](q − 3) over p ∈ primes 5..29
show ∑[n in 1..10] 1/n as "harmonic" digits 20
draw line table[p in primes 5..23](level: p, n: f(p, 1)): level -> n log y as "growth"
f(2, 3)`)).toEqual(['let', 'let', 'claim', 'show', 'draw', 'expr']);
  });

  it('reads ASCII and mathematical spellings alike', () => {
    const a = parse('prod[q in primes 5..p] (q - 2) * 2 != 3 <= 4');
    const b = parse('∏[q ∈ primes 5..p] (q − 2) · 2 ≠ 3 ≤ 4');
    const strip = (x: unknown) => JSON.stringify(x, (k, v) => (k === 'span' || k === 'nameSpan' ? undefined : typeof v === 'bigint' ? `${v}n` : v));
    expect(strip(a.program)).toEqual(strip(b.program));
  });

  it('gives ∑ and ∏ a product as body and quantifiers a comparison', () => {
    const s = parse('∑[n ∈ 1..3] 1/n + 1').program.statements[0] as Extract<Stmt, { t: 'expr' }>;
    expect(s.value.t).toBe('arith'); // (∑ 1/n) + 1
    const q = parse('∀[h ∈ H] h mod 2 = 0 and true').program.statements[0] as Extract<Stmt, { t: 'expr' }>;
    expect(q.value.t).toBe('logic'); // (∀ … = 0) and true
  });

  it('joins lines inside brackets and around operators, splits statements at line ends and ;', () => {
    expect(kinds('let x = (1 +\n  2)\n  + 3\nshow x; show x')).toEqual(['let', 'show', 'show']);
    expect(kinds('claim x = 1\n  over x ∈ 1..1')).toEqual(['claim']);
  });

  it('parses literals exactly: 1e9 and 1_000 are integers, 0.25 is the rational 1/4', () => {
    const lit = (src: string) => (parse(src).program.statements[0] as Extract<Stmt, { t: 'expr' }>).value;
    expect(lit('1e9')).toMatchObject({ t: 'int', value: 1_000_000_000n });
    expect(lit('1_000')).toMatchObject({ t: 'int', value: 1000n });
    expect(String((lit('0.25') as { value: unknown }).value)).toBe('1/4');
  });

  it('parses set-builder tuples, series builders, records, prefix # and postfix # !', () => {
    expect(kinds('{h : h ∈ 0..30, h mod 6 = 0}\n[p^2 : p ∈ primes 2..20]\n(a: 1, b: "x").a\n#[p ∈ primes 1..100] p mod 4 = 1\n7# + 5!')).toEqual(['expr', 'expr', 'expr', 'expr', 'expr']);
  });

  it('ignores comments', () => {
    expect(kinds('// a note\nlet x = 1 // trailing\nx')).toEqual(['let', 'expr']);
  });
});

describe('Sift grammar: invalid programs and positions', () => {
  const errs = (src: string) => parse(src).errors.map((e) => ({ kind: e.kind, line: e.span?.line, column: e.span?.column, message: e.message }));

  it('reports an unexpected token with line and column', () => {
    expect(errs('let x = 1\nlet y = * 2')).toEqual([
      { kind: 'syntax', line: 2, column: 9, message: "unexpected '*': expected a value (number, name, string, tuple {…}, series […], (…) or ∑/∏/∀/∃/#/table[…])" },
    ]);
  });

  it('reports a missing closing bracket at the end of the statement', () => {
    const [e] = errs('show f(1, 2');
    expect(e).toMatchObject({ kind: 'syntax', line: 1, column: 12 });
    expect(e!.message).toContain("expected ')'");
  });

  it('collects the errors of every faulty statement at once', () => {
    const r = errs('let = 3\nshow 1\nlet y = (1 +)\nshow 1 2\n2 ^^ 3');
    expect(r.map((e) => e.line)).toEqual([1, 3, 4, 5]);
    expect(r.every((e) => e.kind === 'syntax')).toBe(true);
  });

  it('reports unknown characters and unmatched closers', () => {
    expect(errs('let x = 3 $ 4')[0]).toMatchObject({ kind: 'syntax', line: 1, column: 11, message: "unexpected character '$'" });
    expect(errs('x)')[0]).toMatchObject({ kind: 'syntax', line: 1, column: 2, message: "unmatched ')'" });
  });

  it('rejects two statements on one line with a hint', () => {
    expect(errs('let x = 1 show x')[0]!.message).toContain('put a new statement on its own line');
  });

  it('checks draw shapes', () => {
    expect(errs('draw pie T: a -> b')[0]).toMatchObject({ kind: 'syntax', column: 6, message: "'pie' is not a chart kind; write line, scatter or bar" });
    expect(errs('draw line T: a -> b log z')[0]!.message).toContain("unknown chart option 'log z'");
  });

  it('only names can be called', () => {
    expect(errs('[f](2)')[0]!.message).toBe('only a named function can be called: write name(arguments)');
  });
});

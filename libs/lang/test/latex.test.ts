import { describe, expect, it } from 'vitest';
import { claimsToLatex, parse, statementToLatex } from '../src';

const math = (source: string): string => {
  const { program, errors } = parse(source);
  expect(errors).toEqual([]);
  return statementToLatex(program.statements[0]!, { source })!;
};

describe('the LaTeX printer', () => {
  it.each([
    ['∏[q ∈ primes 5..p](q − 2)', '\\prod_{\\substack{5 \\le q \\le p \\\\ q \\text{ prime}}} \\left(q - 2\\right)'],
    ['∑[k ∈ 1..n] 1/k', '\\sum_{k = 1}^{n} 1 / k'],
    ['sum[k ∈ 1..10](k^2)', '\\sum_{k = 1}^{10} {k}^{2}'],
    ['2·∏[q ∈ primes 5..p](q − 2) − 2·∏[q ∈ primes 5..p](q − 3)',
      '2 \\cdot \\prod_{\\substack{5 \\le q \\le p \\\\ q \\text{ prime}}} \\left(q - 2\\right) - 2 \\cdot \\prod_{\\substack{5 \\le q \\le p \\\\ q \\text{ prime}}} \\left(q - 3\\right)'],
    ['a - (b + c)', '\\mathit{a} - \\left(b + c\\right)'.replace('\\mathit{a}', 'a')],
    ['(a + b) * c', '\\left(a + b\\right) \\cdot c'],
    ['-(x^2)', '-{x}^{2}'],
    ['p# mod 7 ≠ 0', 'p\\# \\bmod 7 \\neq 0'],
    ['gapcount(6, p) ≥ 1', '\\operatorname{gapcount}\\left(6, p\\right) \\ge 1'],
    ['∀[n ∈ 1…p](n · n ≥ n)', '\\forall\\, 1 \\le n \\le p\\colon\\ n \\cdot n \\ge n'],
    ['∃[q ∈ primes 2..p](q ≤ p) and not (x ≈ 1)', '\\exists\\, 2 \\le q \\le p,\\ q \\text{ prime}\\colon\\ q \\le p \\wedge \\neg x \\approx 1'],
    ['#[p ∈ primes 1..100](p mod 4 = 1)', '\\#\\{\\, 1 \\le p \\le 100,\\ p \\text{ prime} : p \\bmod 4 = 1 \\,\\}'],
    ['φ(30) + α·Ω', '\\varphi\\left(30\\right) + \\alpha \\cdot \\Omega'],
    ['σ2(12) + xφ', '\\operatorname{\\sigma 2}\\left(12\\right) + \\mathit{x\\varphi }'],
    ['wheelsize(23) = 36495360', '\\operatorname{wheelsize}\\left(23\\right) = 36\\,495\\,360'],
    ['if x > 0 then 1 else 2', '\\begin{cases} 1 & \\text{if } x > 0 \\\\ 2 & \\text{otherwise} \\end{cases}'],
    ['0.25 + 1', '0.25 + 1'],
    ['twin_count', '\\mathit{twin\\_count}'],
  ])('%s', (source, latex) => {
    expect(math(source)).toBe(latex);
  });

  it('prints a claim with its label and the range it is checked over', () => {
    expect(claimsToLatex('claim sixes: gapcount(6, p) = 2\n  over p ∈ primes 5..23')).toEqual([
      { label: 'sixes', statement: '\\operatorname{gapcount}\\left(6, p\\right) = 2', over: '5 \\le p \\le 23,\\ p \\text{ prime}' },
    ]);
    expect(claimsToLatex('claim 1 = 1')).toEqual([{ label: null, statement: '1 = 1', over: null }]);
    // A source that does not parse gives no claims (the listing beside it shows the text).
    expect(claimsToLatex('claim (')).toEqual([]);
  });
});

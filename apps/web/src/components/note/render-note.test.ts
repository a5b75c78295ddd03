import { describe, expect, it } from 'vitest';
import { renderNote } from './render-note';

describe('renderNote', () => {
  it('renders Markdown', () => {
    const html = renderNote('# Twin primes\n\nThe pair **(p, p + 2)**.');
    expect(html).toContain('<h1>Twin primes</h1>');
    expect(html).toContain('<strong>(p, p + 2)</strong>');
  });

  it('renders inline and display maths with KaTeX', () => {
    const html = renderNote('The primorial $p\\#$ and\n\n$$\\varphi(30) = 8$$\n');
    expect(html.match(/class="katex"/g)?.length).toBe(2);
    expect(html).toContain('katex-display');
    expect(html).toContain('<math');
  });

  it('renders $$ … $$ inside a line as display maths', () => {
    const html = renderNote('The count follows $$2\\prod_{5 \\le q \\le p}(q-2)$$ here.');
    expect(html).toContain('katex-display');
    expect(html).not.toContain('$');
  });

  it('does not take a price for maths', () => {
    expect(renderNote('costs $5 and $6')).not.toContain('katex');
  });

  it('shows a TeX error in place instead of throwing', () => {
    expect(() => renderNote('$\\frac{1$')).not.toThrow();
  });

  it('strips script and event handlers from raw HTML', () => {
    const html = renderNote('<script>alert(1)</script><img src="x" onerror="alert(2)"><a href="javascript:alert(3)">x</a>');
    expect(html).not.toMatch(/<script|onerror|javascript:/i);
  });
});

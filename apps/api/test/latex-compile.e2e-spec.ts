import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { renderNotebook } from '../src/exports/notebook-document';
import { latexWriter } from '../src/exports/latex-writer';
import { compileLatex, flat, notebookFromFile } from './helpers/latex';

// The LaTeX export compiled by pdflatex (Debian's TeX Live, installed by the test launcher) for every
// demo notebook and for a notebook using every Unicode symbol Sift accepts; the PDF read back by pdftotext.
const SEEDS = join(__dirname, '..', '..', '..', 'seeds-demo');
const manifest = JSON.parse(readFileSync(join(SEEDS, 'notebooks.json'), 'utf8')) as {
  notebooks: Array<{ file: string; uploads?: Array<{ name: string; file: string }> }>;
};

function uploadsOf(entry: (typeof manifest.notebooks)[number]) {
  return Object.fromEntries(
    (entry.uploads ?? []).map((u) => {
      const values = readFileSync(join(SEEDS, u.file), 'utf8').split(/\r?\n/).map((l) => l.trim()).filter((l) => l && !l.startsWith('#')).map(BigInt);
      return [u.name, { kind: 'tuples' as const, values }];
    }),
  );
}

const latexOf = (file: string, uploads = {}) => renderNotebook(notebookFromFile(readFileSync(file, 'utf8'), uploads), latexWriter);

describe('LaTeX export compiled with pdflatex', () => {
  jest.setTimeout(240_000);

  for (const entry of manifest.notebooks) {
    it(`compiles the demo notebook ${entry.file} without errors`, () => {
      const tex = latexOf(join(SEEDS, entry.file), uploadsOf(entry));
      expect(tex).not.toMatch(/--- failed at/); // every cell ran, so all of its output is typeset
      const pdf = compileLatex(tex);
      expect(pdf.errors).toEqual([]);
      expect(pdf.status).toBe(0);
      expect(pdf.pages).toBeGreaterThan(0);
    });
  }

  it('typesets the gap-pattern notebook: checked ranges, table numbers, claims as mathematics, evidence once per claim', () => {
    const tex = latexOf(join(SEEDS, 'notebooks/gap-patterns-across-levels.sift'));
    // The claim printed from its syntax tree: ∏[q ∈ primes 5..p](q − 2) is a product with a subscript.
    expect(tex).toContain('\\prod_{\\substack{5 \\le q \\le p \\\\ q \\text{ prime}}} \\left(q - 2\\right)');
    expect(tex).toContain('\\text{for } 5 \\le p \\le 23,\\ p \\text{ prime}');
    // Numbers right-aligned; the level table spans its header on every page (longtable).
    expect(tex).toMatch(/\\begin\{longtable\}\{@\{\}rrrrr@\{\}\}/);
    // Once per claim (two claims), after the verdict sentence.
    expect(tex.match(/computed evidence/gi)).toHaveLength(2);
    // The chart of gaps 2, 4, 6 by level as a pgfplots figure with a log y axis and its three series.
    expect(tex).toMatch(/\\begin\{axis\}\[[^\]]*ymode=log/);
    for (const series of ['twos', 'fours', 'sixes']) expect(tex).toContain(`\\addlegendentry{${series}}`);
    const pdf = compileLatex(tex);
    expect(pdf.errors).toEqual([]);
    const text = flat(pdf.text);
    // φ(23#) = 36495360: the size of wheel level 23 (OEIS A005867, the totients of the primorials).
    // A table row read back whole: level 23, φ(23#) = 36495360 members (OEIS A005867), 7952175 gaps 2 and
    // 7952175 gaps 4 (∏(q − 2) over 3 ≤ q ≤ 23, OEIS A059861 — from memory), 10169950 gaps 6 (the claim's formula).
    expect(flat(pdf.layout)).toContain('23 36495360 7952175 7952175 10169950');
    // The checked range of the claims, as Sift reports it.
    expect(text).toContain('Claim balance holds for every p ∈ primes 3..23 (8 cases, every case checked).');
    expect(text).toContain('Claim sixes holds for every p ∈ primes 5..23 (7 cases, every case checked).');
    expect(text.match(/Beyond that range this is computed evidence, not a proof/g)).toHaveLength(2);
  });

  it('compiles the all-symbols notebook: listings map the symbols, notes keep their maths, charts become pgfplots figures', () => {
    const tex = latexOf(join(__dirname, 'fixtures', 'all-symbols.sift'));
    expect(tex).toContain('$\\prod_{5 \\le q \\le p} (q - 2)$');
    expect(tex).toContain('\\[\\sum_{p \\le  x} 1 \\sim \\frac{x}{\\log x}\\]');
    expect(tex).toContain('100\\% \\& \\#1 \\emph{under}');
    expect(tex).toContain('\\usepackage{pgfplots}');
    expect(tex).toMatch(/\\begin\{axis\}\[[^\]]*ymode=log/);
    expect(tex).toContain('\\addlegendentry{cube}');
    expect(tex).toContain('\\forall\\, 1 \\le n \\le p\\colon\\ n \\cdot n \\ge n');
    const pdf = compileLatex(tex);
    expect(pdf.errors).toEqual([]);
    expect(pdf.status).toBe(0);
    const text = flat(pdf.text);
    expect(text).toContain('Powers of k');
    expect(text).toContain('[U+2603]'); // a character pdflatex cannot set is written as its code point
    expect(text).toContain('holds for every p ∈ primes 3..29 (9 cases, every case checked');
    // Every cell of the fixture ran (a cell that fails to parse would hide its symbols from the test).
    expect(text).not.toMatch(/failed at|error \(/);
    // The table of k, k², k − 1 read back row by row (numbers right-aligned).
    expect(flat(pdf.layout)).toContain('6 36 5');
  });

  it('wraps long source lines instead of running off the page', () => {
    const long = `show ${Array.from({ length: 60 }, (_, i) => `gapcount(${2 * (i + 1)}, 13)`).join(' + ')}`;
    const nb = notebookFromFile(`@@@ title: Long lines\n\n@@ query Long\n${long}\n`);
    const pdf = compileLatex(renderNotebook(nb, latexWriter), true);
    try {
      expect(pdf.errors).toEqual([]);
      const log = readFileSync(join(pdf.dir, 'doc.log'), 'latin1');
      expect(log).not.toMatch(/Overfull \\hbox \((?:[2-9]\d|\d{3,})\.\d+pt too wide\)/);
      expect(flat(pdf.text)).toContain('gapcount(116, 13)');
    } finally {
      pdf.cleanup();
    }
  });
});

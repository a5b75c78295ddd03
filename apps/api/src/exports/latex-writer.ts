import type { NotebookView } from '@cribra/contracts';
import { claimsToLatex } from '@cribra/lang';
import { chartToPgfplots, type ChartData } from './latex-chart';
import { latexText, listingLiterate, listingText } from './latex-text';
import { markdownToLatex } from './markdown-latex';
import type { DocumentWriter } from './notebook-document';

const NUMERIC = /^[-−]?\d[\d_]*(?:[./]\d+)?(?:e[-+]?\d+)?$/i;

/** Right-aligned columns for numbers (every non-empty cell a number), left-aligned otherwise. */
export function columnSpec(rows: string[][], width: number): string {
  return Array.from({ length: width }, (_, i) => {
    const cells = rows.map((r) => (r[i] ?? '').trim()).filter(Boolean);
    return cells.length > 0 && cells.every((c) => NUMERIC.test(c)) ? 'r' : 'l';
  }).join('');
}

// A listing that never ends early: \end{lstlisting} inside a source cannot close it (a space is put in).
const listing = (text: string, style: 'sift' | 'plain'): string =>
  `\\begin{lstlisting}[style=${style}]\n${listingText(text).replace(/\\end\{lstlisting\}/g, '\\end {lstlisting}')}\n\\end{lstlisting}`;

const PGF_MARK = '%%CRIBRA-PGFPLOTS%%';

/**
 * A standalone article for pdflatex with Debian's texlive-latex-base and -recommended (plus
 * texlive-pictures for pgfplots when the document has a chart): no font packages beyond the
 * defaults, every character outside ASCII either mapped or written as its code point.
 */
export const latexWriter: DocumentWriter = {
  begin: (nb: NotebookView, stamp?: string) =>
    [
      '\\documentclass[11pt]{article}',
      '\\usepackage[utf8]{inputenc}',
      '\\usepackage[a4paper,margin=25mm]{geometry}',
      '\\usepackage{amsmath,amssymb}',
      '\\usepackage{array,longtable,booktabs}',
      '\\usepackage{listings}',
      '\\usepackage{url}',
      PGF_MARK,
      // Sift source: long lines wrap (with a mark), its Unicode symbols are set as mathematics.
      `\\lstdefinestyle{sift}{basicstyle=\\ttfamily\\small,columns=fullflexible,keepspaces=true,breaklines=true,breakatwhitespace=false,` +
        `postbreak=\\mbox{\\ensuremath{\\hookrightarrow}\\space},upquote=false,showstringspaces=false,extendedchars=true,` +
        `frame=leftline,framesep=6pt,xleftmargin=8pt,comment=[l]{//},commentstyle=\\itshape,morestring=[b]",` +
        `literate=${listingLiterate()}}`,
      `\\lstdefinestyle{plain}{basicstyle=\\ttfamily\\small,columns=fullflexible,keepspaces=true,breaklines=true,breakatwhitespace=false,` +
        `postbreak=\\mbox{\\ensuremath{\\hookrightarrow}\\space},extendedchars=true,literate=${listingLiterate()}}`,
      '\\setlength{\\LTleft}{0pt}',
      `\\title{${latexText(nb.title)}}`,
      `\\author{${latexText(nb.owner.displayName)}}`,
      '\\date{}',
      '\\begin{document}',
      '\\maketitle',
      nb.summary ? `\\begin{abstract}\n${latexText(nb.summary)}\n\\end{abstract}` : '',
      `\\noindent\\textit{Status: ${latexText(nb.status.replace('_', ' '))}; revision ${nb.revision}; ${stamp ?? `exported ${new Date().toISOString()}`}.}`,
    ]
      .filter(Boolean)
      .join('\n'),
  heading: (text, level) => `\\${level === 1 ? 'section' : 'subsection'}*{${latexText(text)}}`,
  paragraph: (text) => latexText(text),
  note: (markdown) => markdownToLatex(markdown),
  code: (source) => listing(source, 'sift'),
  value: (text) => listing(text, 'plain'),
  claims: (source) =>
    claimsToLatex(source)
      .map((c) => `\\begin{gather*}\n${c.label ? `\\text{${latexText(c.label)}:}\\quad ` : ''}${c.statement}${c.over ? `\\\\\n\\text{for } ${c.over}` : ''}\n\\end{gather*}`)
      .join('\n'),
  chart: (o) => chartToPgfplots(o as ChartData),
  table: (columns, rows) =>
    [
      '{\\small',
      `\\begin{longtable}{@{}${columnSpec(rows, columns.length)}@{}}`,
      '\\toprule',
      `${columns.map((c) => `\\textbf{${latexText(c)}}`).join(' & ')} \\\\`,
      '\\midrule',
      '\\endhead',
      '\\bottomrule',
      '\\endlastfoot',
      ...rows.map((r) => `${r.map(latexText).join(' & ')} \\\\`),
      '\\end{longtable}}',
    ].join('\n'),
  meta: (lines) => `{\\footnotesize\\noindent ${lines.map((l) => `\\mbox{}${latexText(l)}`).join(' \\\\\n')}\\par}`,
  end: () => '\\end{document}',
  finish: (text) => text.replace(PGF_MARK, text.includes('\\begin{axis}') ? '\\usepackage{pgfplots}\n\\pgfplotsset{compat=1.16}' : ''),
};

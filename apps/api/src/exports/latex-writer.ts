import type { NotebookView } from '@cribra/contracts';
import type { DocumentWriter } from './notebook-document';

/** Escapes LaTeX specials in running text. */
export function escapeLatex(s: string): string {
  return s.replace(/[\\{}$&#^_%~]/g, (c) =>
    c === '\\' ? '\\textbackslash{}' : c === '^' ? '\\textasciicircum{}' : c === '~' ? '\\textasciitilde{}' : `\\${c}`,
  );
}

/** A standalone article; code in verbatim, tables in longtable (only standard packages). */
export const latexWriter: DocumentWriter = {
  begin: (nb: NotebookView) =>
    [
      '\\documentclass{article}',
      '\\usepackage[utf8]{inputenc}',
      '\\usepackage[T1]{fontenc}',
      '\\usepackage{longtable}',
      '\\usepackage{fancyvrb}',
      `\\title{${escapeLatex(nb.title)}}`,
      `\\author{${escapeLatex(nb.owner.displayName)}}`,
      '\\date{}',
      '\\begin{document}',
      '\\maketitle',
      nb.summary ? escapeLatex(nb.summary) : '',
      `\\noindent\\textit{Status: ${escapeLatex(nb.status.replace('_', ' '))}; revision ${nb.revision}; exported ${new Date().toISOString()}.}`,
    ]
      .filter(Boolean)
      .join('\n'),
  heading: (text, level) => `\\${level === 1 ? 'section' : 'subsection'}*{${escapeLatex(text)}}`,
  paragraph: (text) => escapeLatex(text),
  // fancyvrb's Verbatim ends only at \end{Verbatim} on its own line, so the source cannot break out.
  code: (source) => `\\begin{Verbatim}[fontsize=\\small]\n${source.replace(/\\end\{Verbatim\}/g, '\\end {Verbatim}')}\n\\end{Verbatim}`,
  table: (columns, rows) =>
    [
      `\\begin{longtable}{${columns.map(() => 'l').join('')}}`,
      `${columns.map((c) => `\\textbf{${escapeLatex(c)}}`).join(' & ')} \\\\ \\hline`,
      ...rows.map((r) => `${r.map(escapeLatex).join(' & ')} \\\\`),
      '\\end{longtable}',
    ].join('\n'),
  meta: (lines) => `{\\footnotesize\\noindent ${lines.map(escapeLatex).join(' \\\\\n')}}`,
  end: () => '\\end{document}',
};

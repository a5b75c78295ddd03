// The notebook file format (.sift): a header of `@@@ key: value` lines, then cells, each opened by
// a marker line `@@ <kind> [title]` with kind query, claim or note. A cell line that itself starts
// with `@@` (or with backslashes then `@@`) is written with one more leading backslash. Plain UTF-8 text, LF line ends.

export type NotebookCellKind = 'query' | 'claim' | 'note';

export interface NotebookFileCell {
  kind: NotebookCellKind;
  title: string | null;
  source: string;
}

export interface NotebookFile {
  /** `@@@ title: …` */
  title: string | null;
  /** Other header lines (`@@@ key: value`), in order. */
  meta: Array<[string, string]>;
  cells: NotebookFileCell[];
}

export interface NotebookFileError {
  line: number;
  message: string;
}

export interface ParsedNotebookFile {
  notebook: NotebookFile;
  /** Cell line (1-based) of each cell's marker, in cell order. */
  cellLines: number[];
  errors: NotebookFileError[];
}

const KINDS: readonly NotebookCellKind[] = ['query', 'claim', 'note'];
const MARKER = /^@@(?!@)[ \t]*(\S*)[ \t]*(.*?)[ \t]*$/;
const HEADER = /^@@@[ \t]*([A-Za-z][\w-]*)[ \t]*:[ \t]?(.*?)[ \t]*$/;

/** Reads a notebook file; problems (unknown kinds, text before the first cell) come back as errors with line numbers. */
export function parseNotebookFile(text: string): ParsedNotebookFile {
  const lines = text.replace(/\r\n?/g, '\n').split('\n');
  const notebook: NotebookFile = { title: null, meta: [], cells: [] };
  const cellLines: number[] = [];
  const errors: NotebookFileError[] = [];
  let current: { cell: NotebookFileCell; lines: string[] } | null = null;
  const flush = () => {
    if (!current) return;
    while (current.lines.length && current.lines[current.lines.length - 1]!.trim() === '') current.lines.pop();
    current.cell.source = current.lines.join('\n');
    notebook.cells.push(current.cell);
  };
  lines.forEach((line, i) => {
    const n = i + 1;
    if (line.startsWith('@@@')) {
      const h = HEADER.exec(line);
      if (current || !h) {
        errors.push({ line: n, message: current ? 'header lines (@@@) belong before the first cell' : 'a header line reads @@@ key: value' });
        return;
      }
      if (h[1]!.toLowerCase() === 'title') notebook.title = h[2]!;
      else notebook.meta.push([h[1]!, h[2]!]);
      return;
    }
    const m = line.startsWith('@@') ? MARKER.exec(line) : null;
    if (m) {
      const kind = m[1]!.toLowerCase() as NotebookCellKind;
      if (!KINDS.includes(kind)) {
        errors.push({ line: n, message: `unknown cell kind '${m[1]}'; a cell is query, claim or note` });
        return;
      }
      flush();
      current = { cell: { kind, title: m[2] ? m[2] : null, source: '' }, lines: [] };
      cellLines.push(n);
      return;
    }
    if (!current) {
      if (line.trim() !== '') errors.push({ line: n, message: 'text before the first cell marker (@@ query, @@ claim or @@ note)' });
      return;
    }
    current.lines.push(/^\\+@@/.test(line) ? line.slice(1) : line);
  });
  flush();
  return { notebook, cellLines, errors };
}

/** Writes a notebook file; parseNotebookFile(formatNotebookFile(nb)) gives nb back (trailing blank lines of cells trimmed). */
export function formatNotebookFile(nb: NotebookFile): string {
  const out: string[] = [];
  if (nb.title !== null) out.push(`@@@ title: ${oneLine(nb.title)}`);
  for (const [k, v] of nb.meta) out.push(`@@@ ${k}: ${oneLine(v)}`);
  if (out.length) out.push('');
  for (const cell of nb.cells) {
    out.push(`@@ ${cell.kind}${cell.title ? ` ${oneLine(cell.title)}` : ''}`);
    const body = cell.source.replace(/\r\n?/g, '\n').replace(/\s+$/, '');
    if (body) out.push(...body.split('\n').map((l) => (/^\\*@@/.test(l) ? `\\${l}` : l)));
    out.push('');
  }
  return out.join('\n');
}

function oneLine(s: string): string {
  return s.replace(/\s*\n\s*/g, ' ').trim();
}

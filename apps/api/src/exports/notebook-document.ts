import type { CellView, NotebookView, RunOutput, RunView } from '@cribra/contracts';
import { verdictSentence, type VerdictContext, type VerdictOutput } from '@cribra/lang';
import { asTable, cellText } from './table-export';

/**
 * Renders a notebook with its latest results as Markdown or LaTeX. Output variants come from
 * Sift; known shapes (tables, verdicts, text, values) are typeset, anything else is shown as JSON.
 * A claim's verdict always carries the checked range: computed evidence is not a proof.
 */
export interface DocumentWriter {
  heading(text: string, level: 1 | 2): string;
  paragraph(text: string): string;
  /** A note cell's Markdown. */
  note(markdown: string): string;
  /** A cell's Sift source. */
  code(source: string): string;
  /** A value's exact text (may be very long). */
  value(text: string): string;
  /** The claims of a claim cell as mathematics (after the source), or '' when the format has none. */
  claims(source: string): string;
  chart(output: RunOutput): string;
  table(columns: string[], rows: string[][]): string;
  meta(lines: string[]): string;
  /** `stamp`: the date line under the title (default: exported now). */
  begin(nb: NotebookView, stamp?: string): string;
  end(): string;
  /** Last touch on the whole text (LaTeX: load pgfplots only when a figure uses it). */
  finish?(text: string): string;
}

/**
 * Said once per claim that holds over a range: the range itself was checked in every case (so the
 * finite statement is shown), anything beyond it is not.
 */
export const EVIDENCE_WORDING = 'Beyond that range this is computed evidence, not a proof.';

/** A claim's verdict in one paragraph, in the words of Sift's verdict sentence (its range, its cases). */
export function describeVerdict(o: RunOutput, context: VerdictContext = {}): string {
  const v = o as unknown as VerdictOutput;
  const name = v.label ? `${v.label} ` : '';
  if (v.holds === true) return `Claim ${name}${verdictSentence(v, context)}.${v.over ? ` ${EVIDENCE_WORDING}` : ''}`;
  const where = v.over ? ` over ${v.over}` : '';
  const cases = typeof v.checked === 'number' ? ` after ${v.checked} ${v.checked === 1 ? 'case' : 'cases'}` : '';
  // Sift's summary names the counterexample with both sides.
  const summary = typeof v.summary === 'string' ? ` ${v.summary.charAt(0).toUpperCase()}${v.summary.slice(1)}.` : '';
  return `Claim ${name}fails${where}${cases}.${summary}`;
}

function renderOutput(w: DocumentWriter, o: RunOutput, context: VerdictContext): string {
  const label = typeof o.label === 'string' && o.label ? `${o.label} = ` : '';
  const table = asTable(o);
  if (table) return (label ? w.paragraph(String(o.label)) + '\n\n' : '') + w.table(table.columns, table.rows.map((r) => r.map(cellText)));
  if (o.kind === 'verdict') return w.paragraph(describeVerdict(o, context));
  if (o.kind === 'text' && typeof o.text === 'string') return w.paragraph(o.text);
  if (o.kind === 'value' && typeof o.text === 'string') return w.value(`${label}${o.text}`);
  if (o.kind === 'chart') return w.chart(o);
  return w.value(JSON.stringify(o, null, 2));
}

function runMeta(run: RunView, cell: CellView): string[] {
  const lines = [
    `run ${run.id} — ${run.status}${run.finishedAt ? ` at ${run.finishedAt}` : ''}`,
    `cell revision ${run.cellRevision}${run.cellRevision !== cell.revision ? ` (the cell is now at revision ${cell.revision}; this result is older)` : ''}`,
  ];
  if (run.outputDigest) lines.push(`output digest ${run.outputDigest}`);
  if (run.engineVersion || run.languageVersion) lines.push(`engine ${run.engineVersion ?? '?'}, Sift ${run.languageVersion ?? '?'}`);
  if (run.error) lines.push(`error (${run.error.kind}): ${run.error.message}`);
  return lines;
}

export interface RenderOptions {
  /** Replaces "exported <now>" under the title (a published record is the same file every time). */
  stamp?: string;
  /** Cell titles by cell id (shown in the cell headings). */
  titles?: Record<string, string | null>;
  /** Sections after the cells (a record's reviewers, hashes, citation). */
  appendix?: string[];
}

export function renderNotebook(nb: NotebookView, w: DocumentWriter, opts: RenderOptions = {}): string {
  const out: string[] = [w.begin(nb, opts.stamp)];
  // A note that states more than a claim's range is answered in that claim's verdict.
  const notes = nb.cells.filter((c) => c.kind === 'note').map((c) => c.source);
  nb.cells.forEach((cell, i) => {
    const title = opts.titles?.[cell.id] ?? (cell as { title?: string | null }).title ?? null;
    out.push(w.heading(`Cell ${i + 1} · ${cell.kind}${title ? ` · ${title}` : ''}`, 2));
    if (cell.kind === 'note') {
      out.push(w.note(cell.source));
      return;
    }
    out.push(w.code(cell.source));
    if (cell.kind === 'claim') out.push(w.claims(cell.source));
    const run = cell.latestRun;
    if (!run) {
      out.push(w.paragraph('Not run yet.'));
      return;
    }
    out.push(w.meta(runMeta(run, cell)));
    for (const o of run.outputs ?? []) out.push(renderOutput(w, o, { title, notes }));
  });
  out.push(...(opts.appendix ?? []));
  out.push(w.end());
  const text = out.filter(Boolean).join('\n\n') + '\n';
  return w.finish ? w.finish(text) : text;
}

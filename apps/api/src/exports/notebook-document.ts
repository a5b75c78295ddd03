import type { CellView, NotebookView, RunOutput, RunView } from '@cribra/contracts';
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

/** The evidence sentence, said once per claim (Sift's own summary says it too, so that is not repeated). */
export const EVIDENCE_WORDING = 'Computed evidence over the checked range, not a proof.';

export function describeVerdict(o: RunOutput): string {
  const v = o as { holds?: unknown; over?: unknown; checked?: unknown; skipped?: unknown; summary?: unknown; statement?: unknown; label?: unknown };
  const verdict = v.holds === true ? 'holds' : v.holds === false ? 'fails' : 'has no verdict';
  const name = typeof v.label === 'string' && v.label ? `${v.label} ` : '';
  const parts = [`Claim ${name}${verdict}`];
  if (typeof v.over === 'string') parts.push(`over ${v.over}`);
  if (typeof v.checked === 'number') parts.push(`${v.checked} case(s) checked`);
  if (typeof v.skipped === 'number' && v.skipped > 0) parts.push(`${v.skipped} left out by its conditions`);
  const text = `${parts.join(', ')}.`;
  if (v.holds === true) return `${text} ${EVIDENCE_WORDING}`;
  // A failing claim: Sift's summary names the counterexample.
  return typeof v.summary === 'string' ? `${text} ${v.summary.charAt(0).toUpperCase()}${v.summary.slice(1)}.` : text;
}

function renderOutput(w: DocumentWriter, o: RunOutput): string {
  const label = typeof o.label === 'string' && o.label ? `${o.label} = ` : '';
  const table = asTable(o);
  if (table) return (label ? w.paragraph(String(o.label)) + '\n\n' : '') + w.table(table.columns, table.rows.map((r) => r.map(cellText)));
  if (o.kind === 'verdict') return w.paragraph(describeVerdict(o));
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
    for (const o of run.outputs ?? []) out.push(renderOutput(w, o));
  });
  out.push(...(opts.appendix ?? []));
  out.push(w.end());
  const text = out.filter(Boolean).join('\n\n') + '\n';
  return w.finish ? w.finish(text) : text;
}

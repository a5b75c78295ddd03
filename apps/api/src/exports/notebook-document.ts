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
  code(source: string): string;
  table(columns: string[], rows: string[][]): string;
  meta(lines: string[]): string;
  begin(nb: NotebookView): string;
  end(): string;
}

function describeVerdict(o: RunOutput): string {
  const v = o as { holds?: unknown; over?: unknown; checked?: unknown; skipped?: unknown; summary?: unknown; statement?: unknown };
  const verdict = v.holds === true ? 'holds' : v.holds === false ? 'fails' : 'has no verdict';
  const parts = [`Claim ${typeof v.statement === 'string' ? `\`${v.statement}\` ` : ''}${verdict}`];
  if (typeof v.over === 'string') parts.push(`over ${v.over}`);
  if (typeof v.checked === 'number') parts.push(`${v.checked} case(s) checked`);
  const text = `${parts.join(', ')}.${typeof v.summary === 'string' ? ` ${v.summary}` : ''}`;
  return v.holds === true ? `${text} (Computed evidence over the checked range, not a proof.)` : text;
}

function renderOutput(w: DocumentWriter, o: RunOutput): string {
  const label = typeof o.label === 'string' && o.label ? `${o.label} = ` : '';
  const table = asTable(o);
  if (table) return (label ? w.paragraph(String(o.label)) + '\n\n' : '') + w.table(table.columns, table.rows.map((r) => r.map(cellText)));
  if (o.kind === 'verdict') return w.paragraph(describeVerdict(o));
  if (o.kind === 'text' && typeof o.text === 'string') return w.paragraph(o.text);
  if (o.kind === 'value' && typeof o.text === 'string') return w.code(`${label}${o.text}`);
  if (o.kind === 'chart') return w.paragraph(`Chart${typeof o.title === 'string' ? `: ${o.title}` : ''} (see the notebook for the figure).`);
  return w.code(JSON.stringify(o, null, 2));
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

export function renderNotebook(nb: NotebookView, w: DocumentWriter): string {
  const out: string[] = [w.begin(nb)];
  nb.cells.forEach((cell, i) => {
    out.push(w.heading(`Cell ${i + 1} · ${cell.kind}`, 2));
    if (cell.kind === 'note') {
      out.push(w.paragraph(cell.source));
      return;
    }
    out.push(w.code(cell.source));
    const run = cell.latestRun;
    if (!run) {
      out.push(w.paragraph('Not run yet.'));
      return;
    }
    out.push(w.meta(runMeta(run, cell)));
    for (const o of run.outputs ?? []) out.push(renderOutput(w, o));
  });
  out.push(w.end());
  return out.filter(Boolean).join('\n\n') + '\n';
}

import { formatNotebookFile } from '@cribra/lang';
import type { NotebookView } from '@cribra/contracts';

/**
 * The notebook as a `.sift` notebook file (the format of libs/lang, read by `cribra run` and by
 * POST /api/notebooks/import): title, summary and tags as header lines (the summary on one line),
 * then every cell with its kind and title. Outputs are not part of the file: they are re-computed.
 */
export function siftNotebookFile(nb: NotebookView): string {
  const meta: Array<[string, string]> = [];
  if (nb.summary.trim()) meta.push(['summary', nb.summary]);
  if (nb.tags.length) meta.push(['tags', nb.tags.join(', ')]);
  return formatNotebookFile({
    title: nb.title,
    meta,
    cells: nb.cells.map((c) => ({ kind: c.kind, title: c.title, source: c.source })),
  });
}

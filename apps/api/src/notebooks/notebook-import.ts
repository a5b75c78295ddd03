import { parseNotebookFile, type NotebookCellKind } from '@cribra/lang';
import {
  CELL_SOURCE_MAX,
  CELL_TITLE_MAX,
  NOTEBOOK_FILE_EXTENSIONS,
  NOTEBOOK_SUMMARY_MAX,
  NOTEBOOK_TAG_MAX,
  NOTEBOOK_TAGS_MAX,
  NOTEBOOK_TITLE_MAX,
  UPLOAD_MAX_BYTES,
  type NotebookImportDetails,
} from '@cribra/contracts';
import { decodeText } from '../uploads/upload-parser';
import { TEXT_TYPES, type IncomingFile } from '../uploads/uploads.service';
import { TAG_PATTERN } from './dto/create-notebook.dto';

/** At most this many cells in one notebook file (the reorder request takes 2000 ids). */
export const IMPORT_MAX_CELLS = 2000;

export interface ImportedNotebook {
  title: string;
  summary: string;
  tags: string[];
  cells: Array<{ kind: NotebookCellKind; title: string | null; source: string }>;
}

export type ImportOutcome = { ok: true; notebook: ImportedNotebook } | { ok: false; message: string; details: NotebookImportDetails };

const refuse = (reason: NotebookImportDetails['reason'], message: string, errors: NotebookImportDetails['errors'] = []): ImportOutcome => ({
  ok: false,
  message,
  details: { reason, errors },
});

/**
 * Checks and reads an uploaded `.sift` notebook file with the limits of uploads (size, text media
 * type, strict UTF-8) and of notebooks and cells (title, summary, tags, source lengths). Every
 * problem comes back with the line of the file it is on; the caller stores nothing unless ok.
 */
export function readNotebookUpload(file: IncomingFile | undefined): ImportOutcome {
  if (!file) return refuse('empty', 'Attach the notebook file in the multipart field "file"');
  if (file.size > UPLOAD_MAX_BYTES) return refuse('too_large', `The file is larger than ${UPLOAD_MAX_BYTES} bytes`);
  const lower = file.originalname.toLowerCase();
  if (!NOTEBOOK_FILE_EXTENSIONS.some((e) => lower.endsWith(e)) || !TEXT_TYPES.has(file.mimetype.split(';')[0].trim().toLowerCase())) {
    return refuse('bad_type', `Only notebook files (${NOTEBOOK_FILE_EXTENSIONS.join(', ')}) can be imported`);
  }
  if (file.size === 0) return refuse('empty', 'The file is empty');
  const text = decodeText(file.buffer);
  if (text === null) return refuse('bad_type', 'The file is not UTF-8 text', [{ line: 1, message: 'not UTF-8 text' }]);

  const parsed = parseNotebookFile(text);
  const errors = [...parsed.errors];
  const nb = parsed.notebook;
  const headerLine = (key: string): number => {
    const i = text.split(/\r\n?|\n/).findIndex((l) => new RegExp(`^@@@[ \\t]*${key}[ \\t]*:`, 'i').test(l));
    return i < 0 ? 1 : i + 1;
  };
  const title = (nb.title ?? '').trim() || lower.replace(/\.[^.]*$/, '').slice(0, NOTEBOOK_TITLE_MAX) || 'Imported notebook';
  if (title.length > NOTEBOOK_TITLE_MAX) errors.push({ line: headerLine('title'), message: `the title is longer than ${NOTEBOOK_TITLE_MAX} characters` });
  const summary = nb.meta.find(([k]) => k.toLowerCase() === 'summary')?.[1] ?? '';
  if (summary.length > NOTEBOOK_SUMMARY_MAX) errors.push({ line: headerLine('summary'), message: `the summary is longer than ${NOTEBOOK_SUMMARY_MAX} characters` });
  const tagText = nb.meta.find(([k]) => k.toLowerCase() === 'tags')?.[1] ?? '';
  const tags = [...new Set(tagText.split(',').map((t) => t.trim().toLowerCase()).filter(Boolean))];
  if (tags.length > NOTEBOOK_TAGS_MAX) errors.push({ line: headerLine('tags'), message: `more than ${NOTEBOOK_TAGS_MAX} tags` });
  for (const t of tags) {
    if (t.length > NOTEBOOK_TAG_MAX || !TAG_PATTERN.test(t)) {
      errors.push({ line: headerLine('tags'), message: `tag "${t}": tags are 1 to ${NOTEBOOK_TAG_MAX} letters, digits and # + . _ -` });
    }
  }
  if (nb.cells.length > IMPORT_MAX_CELLS) errors.push({ line: parsed.cellLines[IMPORT_MAX_CELLS]!, message: `more than ${IMPORT_MAX_CELLS} cells` });
  nb.cells.forEach((c, i) => {
    const line = parsed.cellLines[i]!;
    if (c.title && c.title.length > CELL_TITLE_MAX) errors.push({ line, message: `the cell title is longer than ${CELL_TITLE_MAX} characters` });
    if (c.source.length > CELL_SOURCE_MAX) errors.push({ line, message: `the cell is longer than ${CELL_SOURCE_MAX} characters` });
  });
  if (errors.length) {
    errors.sort((a, b) => a.line - b.line);
    const first = errors[0]!;
    return refuse(parsed.errors.length ? 'parse_error' : 'invalid', `Line ${first.line}: ${first.message}`, errors);
  }
  return {
    ok: true,
    notebook: { title, summary, tags, cells: nb.cells.map((c) => ({ kind: c.kind, title: c.title?.trim() || null, source: c.source })) },
  };
}

import { parse } from 'csv-parse/sync';
import type { UploadContent, UploadKind } from '@cribra/contracts';

export interface ParseProblem {
  line: number;
  message: string;
}

export type ParseOutcome = { ok: true; content: UploadContent; rowCount: number; columns: string[] | null } | { ok: false; errors: ParseProblem[] };

/** At most this many problems are reported (the rest would only repeat). */
const MAX_PROBLEMS = 20;
export const MAX_ROWS = 200_000;
export const MAX_COLUMNS = 200;
const INTEGER = /^[+-]?\d{1,40}$/;

/** Decodes strict UTF-8 (a binary file is refused rather than read as garbage). */
export function decodeText(buffer: Buffer): string | null {
  if (buffer.includes(0)) return null;
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(buffer).replace(/^\uFEFF/, '');
  } catch {
    return null;
  }
}

/**
 * Tuple file: one integer per line; `#` starts a comment (whole line or after the number);
 * blank lines are skipped. Values are kept as canonical decimal strings (no size limit below 40
 * digits, so nothing is rounded).
 */
export function parseTuples(text: string): ParseOutcome {
  const values: string[] = [];
  const errors: ParseProblem[] = [];
  /** First line of each value: a tuple is a set of distinct integers, so a repeat is refused. */
  const firstLine = new Map<string, number>();
  const lines = text.split(/\r\n|\n|\r/);
  lines.forEach((raw, i) => {
    const body = raw.replace(/#.*$/, '').trim();
    if (!body) return;
    if (!INTEGER.test(body)) {
      if (errors.length < MAX_PROBLEMS) {
        const shown = body.length > 40 ? `${body.slice(0, 40)}…` : body;
        errors.push({ line: i + 1, message: `"${shown}" is not an integer (one integer per line; # starts a comment)` });
      }
      return;
    }
    const value = BigInt(body).toString();
    const seen = firstLine.get(value);
    if (seen !== undefined) {
      if (errors.length < MAX_PROBLEMS) {
        errors.push({ line: i + 1, message: `${value} appears on lines ${seen} and ${i + 1} (the values of a tuple are distinct)` });
      }
      return;
    }
    firstLine.set(value, i + 1);
    values.push(value);
  });
  if (errors.length) return { ok: false, errors };
  if (!values.length) return { ok: false, errors: [{ line: 1, message: 'the file holds no integers' }] };
  if (values.length > MAX_ROWS) return { ok: false, errors: [{ line: MAX_ROWS + 1, message: `more than ${MAX_ROWS} values` }] };
  return { ok: true, content: { kind: 'tuples', values }, rowCount: values.length, columns: null };
}

/** CSV table with a header row; every row must have as many fields as the header. */
export function parseTable(text: string): ParseOutcome {
  let records: Array<{ record: string[]; info: { lines: number } }>;
  try {
    // Stops after the header and MAX_ROWS + 1 rows: a file with more is refused without parsing the rest.
    records = parse(text, { bom: true, skip_empty_lines: true, trim: true, info: true, relax_column_count: true, to: MAX_ROWS + 2 }) as never;
  } catch (err) {
    const e = err as { message?: string; lines?: number };
    return { ok: false, errors: [{ line: e.lines ?? 1, message: (e.message ?? 'not a valid CSV file').replace(/^Invalid .*?: /, '') }] };
  }
  if (!records.length) return { ok: false, errors: [{ line: 1, message: 'the file is empty (a header row is required)' }] };
  const [head, ...body] = records;
  const columns = head.record;
  const errors: ParseProblem[] = [];
  if (columns.length > MAX_COLUMNS) errors.push({ line: head.info.lines, message: `more than ${MAX_COLUMNS} columns` });
  const seen = new Set<string>();
  columns.forEach((c) => {
    if (!c) errors.push({ line: head.info.lines, message: 'a column name in the header is empty' });
    else if (seen.has(c)) errors.push({ line: head.info.lines, message: `column "${c}" appears twice in the header` });
    seen.add(c);
  });
  for (const r of body) {
    if (errors.length >= MAX_PROBLEMS) break;
    if (r.record.length !== columns.length) {
      errors.push({ line: r.info.lines, message: `${r.record.length} fields where the header has ${columns.length}` });
    }
  }
  if (body.length > MAX_ROWS) errors.push({ line: MAX_ROWS + 2, message: `more than ${MAX_ROWS} rows` });
  if (errors.length) return { ok: false, errors: errors.slice(0, MAX_PROBLEMS) };
  return { ok: true, content: { kind: 'table', columns, rows: body.map((r) => r.record) }, rowCount: body.length, columns };
}

/** The kind an upload has by its file name, or null for an unsupported type. */
export function kindOf(fileName: string): UploadKind | null {
  const lower = fileName.toLowerCase();
  if (lower.endsWith('.csv')) return 'table';
  if (lower.endsWith('.txt') || lower.endsWith('.tuples')) return 'tuples';
  return null;
}

import type { RunOutput } from '@cribra/contracts';

export interface Table {
  columns: string[];
  rows: unknown[][];
}

/** A table output has `columns` and `rows` (see RunOutput); anything else is not exportable as one. */
export function asTable(output: RunOutput | undefined): Table | null {
  if (!output) return null;
  const { columns, rows } = output as { columns?: unknown; rows?: unknown };
  if (!Array.isArray(columns) || !Array.isArray(rows) || !rows.every(Array.isArray)) return null;
  return { columns: columns.map(cellText), rows: rows as unknown[][] };
}

/**
 * Text of one cell value: strings as is, numbers and bigints as decimals, Sift values
 * (`{t, v}` JSON from @cribra/lang) by their exact text, anything else as JSON.
 */
export function cellText(v: unknown): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'string') return v;
  if (typeof v === 'number' || typeof v === 'bigint' || typeof v === 'boolean') return String(v);
  const o = v as { t?: string; v?: unknown; lo?: string; hi?: string; columns?: unknown };
  if (o && typeof o === 'object' && typeof o.t === 'string') {
    if (o.t === 'tuple' && Array.isArray(o.v)) return `(${o.v.join(', ')})`;
    if (o.t === 'range') return `${o.lo}..${o.hi}`;
    if (o.t === 'series' && Array.isArray(o.v)) return `[${o.v.map(cellText).join(', ')}]`;
    if (o.t === 'record' && Array.isArray(o.v)) return `{${(o.v as Array<[string, unknown]>).map(([k, x]) => `${k}: ${cellText(x)}`).join(', ')}}`;
    if (typeof o.v === 'string' || typeof o.v === 'number' || typeof o.v === 'boolean') return String(o.v);
  }
  return JSON.stringify(v);
}

/** A plain decimal number (negative ones included): a spreadsheet reads it as a number, never a formula. */
const PLAIN_NUMBER = /^[+-]?\d+(\.\d+)?([eE][+-]?\d+)?$/;

/**
 * A field a spreadsheet would execute as a formula — starting with `=`, `+`, `-`, `@`, a tab or a
 * carriage return — gets a leading `'` (the usual neutralisation), unless it is a plain number
 * such as `-7`. Documented in docs/architecture.md (Uploads, outputs and exports).
 */
export function neutraliseFormula(s: string): string {
  return /^[=+\-@\t\r]/.test(s) && !PLAIN_NUMBER.test(s) ? `'${s}` : s;
}

/**
 * RFC 4180 CSV: fields with a comma, quote or line break are quoted, quotes doubled; CRLF lines;
 * formula-leading fields neutralised (neutraliseFormula).
 */
export function toCsv(t: Table): string {
  const field = (raw: string): string => {
    const s = neutraliseFormula(raw);
    return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
  };
  return [t.columns, ...t.rows.map((r) => r.map(cellText))].map((r) => r.map(field).join(',')).join('\r\n') + '\r\n';
}

/** JSON: one object per row keyed by column name (values as in the output). */
export function toJsonRows(t: Table): Array<Record<string, unknown>> {
  return t.rows.map((r) => Object.fromEntries(t.columns.map((c, i) => [c, r[i] ?? null])));
}

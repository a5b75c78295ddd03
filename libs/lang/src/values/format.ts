import { Rational } from './rational';
import { IntRange, SiftRecord, Table, Tuple, UserFn, type Value } from './types';

const MAX_LISTED = 60;

/** A real as text: shortest round-trip digits, or `digits` significant digits. */
export function formatReal(x: number, digits?: number | null): string {
  if (Number.isNaN(x)) return 'NaN';
  if (!Number.isFinite(x)) return x > 0 ? '∞' : '−∞';
  if (Object.is(x, -0)) x = 0;
  return digits ? x.toPrecision(digits).replace(/\.?0+(e|$)/, '$1').replace(/^(-?\d+)\.$/, '$1') : String(x);
}

/** Plain-text rendering of a value (exact digits for integers and rationals). */
export function formatValue(v: Value, digits?: number | null, nested = false): string {
  switch (typeof v) {
    case 'bigint':
      return v.toString();
    case 'number':
      return formatReal(v, digits);
    case 'boolean':
      return v ? 'true' : 'false';
    case 'string':
      return nested ? JSON.stringify(v) : v;
  }
  if (v instanceof Rational) return v.toString();
  if (v instanceof Tuple) return `{${list(v.offsets.map(String))}}`;
  if (v instanceof IntRange) return `${v.primesOnly ? 'primes ' : ''}${v.lo}..${v.hi}`;
  if (Array.isArray(v)) return `[${list(v.map((x) => formatValue(x, digits, true)))}]`;
  if (v instanceof SiftRecord) return `(${[...v.fields].map(([k, x]) => `${k}: ${formatValue(x, digits, true)}`).join(', ')})`;
  if (v instanceof Table) return nested ? `table(${v.columns.join(', ')}; ${v.rows.length} row${v.rows.length === 1 ? '' : 's'})` : formatTable(v, digits);
  if (v instanceof UserFn) return `${v.name}(${v.params.join(', ')})`;
  return String(v);
}

function list(items: string[]): string {
  if (items.length <= MAX_LISTED) return items.join(', ');
  return `${items.slice(0, MAX_LISTED - 1).join(', ')}, … (${items.length} in all)`;
}

/** A table as aligned text columns (first 200 rows). */
export function formatTable(t: Table, digits?: number | null): string {
  const shown = t.rows.slice(0, 200).map((r) => r.map((c) => formatValue(c, digits, true)));
  const widths = t.columns.map((c, i) => Math.max(c.length, ...shown.map((r) => r[i]!.length)));
  const line = (cells: string[]) => cells.map((c, i) => c.padStart(widths[i]!)).join('  ');
  const out = [line(t.columns), ...shown.map(line)];
  if (t.rows.length > shown.length) out.push(`… ${t.rows.length} rows in all`);
  return out.join('\n');
}

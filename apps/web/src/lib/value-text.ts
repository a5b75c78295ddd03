import { groupDigits } from './format';
import type { Binding, ValueJson } from './sift-output';

export interface TextOptions {
  /** Group digits of integers with thin spaces (display); false gives the exact plain text (copy, CSV). */
  grouped?: boolean;
}

const int = (v: string, o: TextOptions) => (o.grouped === false ? v : groupDigits(v));

/** The text of one Sift value, in Sift's own notation: exact integers and rationals, tuples {a, b, c}, records (k: v). */
export function valueText(value: ValueJson, o: TextOptions = {}): string {
  switch (value.t) {
    case 'int':
      return int(value.v, o);
    case 'rat': {
      const [n, d] = value.v.split('/');
      return d === undefined ? int(n, o) : `${int(n, o)}/${int(d, o)}`;
    }
    case 'real':
      return typeof value.v === 'number' ? String(value.v) : value.v;
    case 'bool':
      return value.v ? 'true' : 'false';
    case 'str':
      return value.v;
    case 'tuple':
      return `{${value.v.map((x) => int(x, o)).join(', ')}}`;
    case 'range':
      return `${value.primes ? 'primes ' : ''}${int(value.lo, o)}..${int(value.hi, o)}`;
    case 'series':
      return `[${value.v.map((x) => valueText(x, o)).join(', ')}]`;
    case 'record':
      return `(${value.v.map(([k, x]) => `${k}: ${valueText(x, o)}`).join(', ')})`;
    case 'table':
      return `table of ${value.rows.length} row${value.rows.length === 1 ? '' : 's'} (${value.columns.join(', ')})`;
    case 'fn':
      return value.v;
    default:
      return JSON.stringify(value);
  }
}

/** A claim binding as "p = 5, k = 3". */
export function bindingText(binding: Binding, o: TextOptions = {}): string {
  return binding.map(([name, v]) => `${name} = ${valueText(v, o)}`).join(', ');
}

/**
 * Orders two cell values for sorting: numerically when both are exact integers (as bigint, so
 * values beyond 2^53 sort right), else by their plain text.
 */
export function compareValues(a: ValueJson | undefined, b: ValueJson | undefined): number {
  if (a?.t === 'int' && b?.t === 'int') {
    const x = BigInt(a.v);
    const y = BigInt(b.v);
    return x < y ? -1 : x > y ? 1 : 0;
  }
  if (a?.t === 'real' && b?.t === 'real' && typeof a.v === 'number' && typeof b.v === 'number') return a.v - b.v;
  const ta = a ? valueText(a, { grouped: false }) : '';
  const tb = b ? valueText(b, { grouped: false }) : '';
  return ta.localeCompare(tb, undefined, { numeric: true });
}

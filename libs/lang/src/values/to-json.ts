import type { ValueJson } from '../outputs/types';
import { Rational } from './rational';
import { formatValue } from './format';
import { IntRange, SiftRecord, Table, Tuple, UserFn, type Value } from './types';

/** A value as JSON: exact numbers as decimal strings, non-finite reals as strings. */
export function valueToJson(v: Value): ValueJson {
  switch (typeof v) {
    case 'bigint':
      return { t: 'int', v: v.toString() };
    case 'number':
      return { t: 'real', v: Number.isNaN(v) ? 'NaN' : v === Infinity ? 'Infinity' : v === -Infinity ? '-Infinity' : Object.is(v, -0) ? 0 : v };
    case 'boolean':
      return { t: 'bool', v };
    case 'string':
      return { t: 'str', v };
  }
  if (v instanceof Rational) return { t: 'rat', v: v.toString() };
  if (v instanceof Tuple) return { t: 'tuple', v: v.offsets.map(String) };
  if (v instanceof IntRange) return { t: 'range', lo: v.lo.toString(), hi: v.hi.toString(), primes: v.primesOnly };
  if (Array.isArray(v)) return { t: 'series', v: v.map(valueToJson) };
  if (v instanceof SiftRecord) return { t: 'record', v: [...v.fields].map(([k, x]) => [k, valueToJson(x)] as [string, ValueJson]) };
  if (v instanceof Table) return { t: 'table', columns: [...v.columns], rows: v.rows.map((r) => r.map(valueToJson)) };
  if (v instanceof UserFn) return { t: 'fn', v: formatValue(v) };
  return { t: 'str', v: String(v) };
}

/** A JSON value as a double for charts (null when it has no numeric reading). */
export function jsonToNumber(j: ValueJson): number | null {
  switch (j.t) {
    case 'int':
      return Number(j.v);
    case 'rat': {
      const [n, d] = j.v.split('/');
      return Number(n) / Number(d);
    }
    case 'real':
      return typeof j.v === 'number' ? j.v : null;
    case 'bool':
      return j.v ? 1 : 0;
    default:
      return null;
  }
}

import { valueJsonText, type ValueJson as LangValueJson } from '@cribra/lang';
import { groupDigits } from './format';
import type { Binding, ValueJson } from './sift-output';

export interface TextOptions {
  /** Group digits of integers with thin spaces (display); false gives the exact plain text (copy, CSV). */
  grouped?: boolean;
}

/** The text of one Sift value in Sift's own notation (see valueJsonText), digits grouped unless `grouped: false`. */
export function valueText(value: ValueJson, o: TextOptions = {}): string {
  return valueJsonText(value as LangValueJson, { formatInteger: o.grouped === false ? undefined : groupDigits });
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

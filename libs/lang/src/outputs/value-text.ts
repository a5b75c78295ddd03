import type { ValueJson } from './types';

export interface ValueTextOptions {
  /** Strings in double quotes (inside messages such as a claim's counterexample). */
  quoteStrings?: boolean;
  /** Rewrites the digits of every exact integer (numerators and denominators too), e.g. to group them. */
  formatInteger?: (digits: string) => string;
}

/**
 * The text of one output value in Sift's own notation: exact integers and rationals, tuples
 * `{a, b, c}`, records `(k: v)`, series `[…]`, ranges `lo..hi`. The one renderer shared by the
 * interpreter's messages, the command line and the web app.
 */
export function valueJsonText(value: ValueJson, options: ValueTextOptions = {}): string {
  const int = options.formatInteger ?? ((digits: string) => digits);
  const text = (v: ValueJson): string => {
    switch (v.t) {
      case 'int':
        return int(v.v);
      case 'rat':
        return v.v.split('/').map((d) => int(d)).join('/');
      case 'real':
        return String(v.v);
      case 'bool':
        return String(v.v);
      case 'str':
        return options.quoteStrings ? JSON.stringify(v.v) : v.v;
      case 'tuple':
        return `{${v.v.map((d) => int(d)).join(', ')}}`;
      case 'range':
        return `${v.primes ? 'primes ' : ''}${int(v.lo)}..${int(v.hi)}`;
      case 'series':
        return `[${v.v.map(text).join(', ')}]`;
      case 'record':
        return `(${v.v.map(([k, x]) => `${k}: ${text(x)}`).join(', ')})`;
      case 'table':
        return `table(${v.columns.join(', ')}; ${v.rows.length} row${v.rows.length === 1 ? '' : 's'})`;
      case 'fn':
        return v.v;
    }
  };
  return text(value);
}

import { domainError } from '../errors';
import { numberValue } from '../syntax/parser';
import { Rational } from '../values/rational';
import { Table, Tuple, type Value } from '../values/types';
import { argSmall, argString, type Builtin, defineBuiltins } from './registry';

/** A CSV cell as a value: integers and decimals become exact numbers, the rest stays text. */
function cellValue(text: string): Value {
  const t = text.trim();
  if (/^-?\d+$/.test(t)) return BigInt(t);
  if (/^-?\d+\.\d+$/.test(t)) {
    const v = numberValue(t.replace('-', ''));
    if (!t.startsWith('-')) return v;
    return typeof v === 'bigint' ? -v : Rational.of(-v.n, v.d);
  }
  return t;
}

const data: Builtin[] = [
  {
    name: 'upload', area: 'data', minArgs: 1, maxArgs: 1,
    signature: 'upload(name) → tuple or table',
    doc: "A file uploaded to the notebook: a tuple file (one integer per line) as a tuple, a CSV file as a table (numbers exact, other cells text).",
    example: { source: 'size(upload("quintuplets"))', result: '5' },
    call: (a, c) => {
      const name = argString(a, 0, c, 'upload');
      const u = c.data?.upload(name) ?? null;
      if (!u) throw domainError(`upload: there is no upload named "${name}" in this notebook`, c.argSpans[0]);
      if (u.kind === 'tuples') {
        const sorted = [...new Set(u.values)].sort((x, y) => (x < y ? -1 : x > y ? 1 : 0));
        if (sorted.length !== u.values.length) throw domainError(`upload: "${name}" lists an offset twice`, c.span);
        return new Tuple(sorted);
      }
      if (u.rows.length > c.limits.maxElements) throw domainError(`upload: "${name}" has more than ${c.limits.maxElements} rows`, c.span);
      c.tick(u.rows.length);
      return new Table([...u.columns], u.rows.map((r) => u.columns.map((_, i) => cellValue(r[i] ?? ''))));
    },
  },
  {
    name: 'isstored', area: 'data', minArgs: 1, maxArgs: 1,
    signature: 'isstored(p) → boolean', doc: 'Whether wheel level p is stored (stored levels are read instead of computed).',
    example: { source: 'isstored(37)', result: 'false' },
    call: (a, c) => Boolean(c.data?.level(argSmall(a, 0, c, 'isstored', 2, 1_000_000))),
  },
];

defineBuiltins(data);

/**
 * Canonical JSON: object keys sorted by UTF-16 code units, no whitespace, `undefined` fields left
 * out, numbers in ECMAScript shortest round-trip form (−0 written as 0), bigints as decimal strings.
 * Non-finite numbers are refused (outputs encode them as strings first).
 */
export function canonicalJson(value: unknown): string {
  const parts: string[] = [];
  write(value, parts);
  return parts.join('');
}

function write(v: unknown, out: string[]): void {
  if (v === null) {
    out.push('null');
    return;
  }
  switch (typeof v) {
    case 'string':
      out.push(JSON.stringify(v));
      return;
    case 'boolean':
      out.push(v ? 'true' : 'false');
      return;
    case 'bigint':
      out.push(JSON.stringify(v.toString()));
      return;
    case 'number':
      if (!Number.isFinite(v)) throw new Error('canonical JSON: non-finite number');
      out.push(Object.is(v, -0) ? '0' : String(v));
      return;
    case 'object': {
      if (Array.isArray(v)) {
        out.push('[');
        v.forEach((x, i) => {
          if (i) out.push(',');
          write(x === undefined ? null : x, out);
        });
        out.push(']');
        return;
      }
      const obj = v as Record<string, unknown>;
      const keys = Object.keys(obj).filter((k) => obj[k] !== undefined).sort();
      out.push('{');
      keys.forEach((k, i) => {
        if (i) out.push(',');
        out.push(JSON.stringify(k), ':');
        write(obj[k], out);
      });
      out.push('}');
      return;
    }
    default:
      throw new Error(`canonical JSON: cannot encode ${typeof v}`);
  }
}

/** U+2009 THIN SPACE, the digit-group separator of the human-readable output. */
export const THIN_SPACE = '\u2009';

/** Groups the digits of an integer of four or more digits by threes with thin spaces: 5760 → "5 760" (docs/glossary.md). */
export function groupDigits(value: bigint | number | string): string {
  const s = String(value);
  const m = /^(-?)(\d+)(.*)$/.exec(s);
  if (!m) return s;
  const [, sign, digits, rest] = m;
  if (digits!.length <= 3) return s;
  return sign + digits!.replace(/\B(?=(\d{3})+(?!\d))/g, THIN_SPACE) + rest;
}

/** JSON with bigints written as decimal strings, pretty-printed, one trailing newline. */
export function toJson(value: unknown): string {
  return `${JSON.stringify(value, (_k, v) => (typeof v === 'bigint' ? v.toString() : v), 2)}\n`;
}

/** A tuple or set of residues in Sift's notation: {0, 2, 6}. */
export function tupleText(values: readonly (number | bigint)[]): string {
  return `{${values.join(', ')}}`;
}

/** A range in Sift's notation, both ends included: 0..1 000 000. */
export function rangeText(from: bigint | number, to: bigint | number): string {
  return `${groupDigits(from)}..${groupDigits(to)}`;
}

/** U+2009 THIN SPACE, the digit-group separator of the human-readable output. */
export const THIN_SPACE = '\u2009';

/** Groups the digits of an integer by three with thin spaces: 1234567 → "1 234 567". */
export function groupDigits(value: bigint | number | string): string {
  const s = String(value);
  const m = /^(-?)(\d+)(.*)$/.exec(s);
  if (!m) return s;
  const [, sign, digits, rest] = m;
  if (digits!.length <= 4) return s;
  return sign + digits!.replace(/\B(?=(\d{3})+(?!\d))/g, THIN_SPACE) + rest;
}

/** JSON with bigints written as decimal strings, pretty-printed, one trailing newline. */
export function toJson(value: unknown): string {
  return `${JSON.stringify(value, (_k, v) => (typeof v === 'bigint' ? v.toString() : v), 2)}\n`;
}

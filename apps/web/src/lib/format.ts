/** Thin space (U+2009) groups digits in results, as the house style asks. */
export const DIGIT_GROUP_SEPARATOR = '\u2009';

/**
 * Groups the digits of an integer written in base 10 by threes with thin spaces.
 * Accepts a bigint, a safe integer or a decimal string (sign and fraction kept; only the integer part grouped).
 */
export function groupDigits(value: bigint | number | string, sep = DIGIT_GROUP_SEPARATOR): string {
  const text = typeof value === 'string' ? value.trim() : value.toString();
  const m = /^([+-]?)(\d+)(\.\d+)?$/.exec(text);
  if (!m) return text;
  const [, sign, int, frac = ''] = m;
  const grouped = int.replace(/\B(?=(\d{3})+(?!\d))/g, sep);
  return `${sign}${grouped}${frac}`;
}

/** A date-time shown in the reader's locale, short form. */
export function formatDateTime(iso: string): string {
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : d.toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });
}

/**
 * Groups every number written in a text: integer parts of four or more digits by threes from the
 * right, decimal fractions of four or more digits by threes from the point. Digits inside names
 * (`p2`, `x10`) are left alone.
 */
export function groupNumbersInText(text: string, sep = DIGIT_GROUP_SEPARATOR): string {
  return text.replace(/(?<![\w.])(\d+)(?:\.(\d+))?(?![\w])/g, (_m, int: string, frac: string | undefined) => {
    const i = int.length >= 4 ? groupDigits(int, sep) : int;
    if (frac === undefined) return i;
    const f = frac.length >= 4 ? frac.replace(/(\d{3})(?=\d)/g, `$1${sep}`) : frac;
    return `${i}.${f}`;
  });
}

import { CliError } from './cli-error';

/**
 * Exact integer from the command line. Accepted forms (optional sign): 1000000, 1_000_000,
 * 1e9 / 1E9 (integer mantissa, no decimal point), 10^12 / 2^40. Anything else — 1.5e3, 0x10,
 * 1e, empty — is rejected, never rounded.
 * @throws CliError naming the flag and the text.
 */
export function parseInteger(text: string, flag: string): bigint {
  const t = text.trim();
  const m = /^([+-]?)(\d+(?:_\d+)*)(?:([eE^])(\d+))?$/.exec(t);
  if (!m) throw new CliError(`${flag}: "${text}" is not an integer (write e.g. 1000, 1_000, 1e9 or 10^12)`);
  const sign = m[1] === '-' ? -1n : 1n;
  const mantissa = BigInt(m[2]!.replace(/_/g, ''));
  if (m[3] === undefined) return sign * mantissa;
  const exponent = Number(m[4]);
  if (exponent > 400) throw new CliError(`${flag}: exponent ${exponent} in "${text}" is too large`);
  const value = m[3] === '^' ? mantissa ** BigInt(exponent) : mantissa * 10n ** BigInt(exponent);
  return sign * value;
}

/**
 * {@link parseInteger} restricted to [min, max] and returned as a number (max ≤ 2^53).
 * @throws CliError when outside the range.
 */
export function parseSmallInteger(text: string, flag: string, min: number, max: number): number {
  const v = parseInteger(text, flag);
  if (v < BigInt(min) || v > BigInt(max)) {
    throw new CliError(`${flag}: ${text} is outside the allowed range ${min} … ${max}`);
  }
  return Number(v);
}

/**
 * A list of integers separated by commas, spaces or semicolons ("0,2,6", "0 2 6").
 * @throws CliError for an empty list or a bad element.
 */
export function parseIntegerList(text: string, flag: string): bigint[] {
  const tokens = text.split(/[\s,;]+/).filter((s) => s !== '');
  if (tokens.length === 0) throw new CliError(`${flag}: empty list`);
  return tokens.map((tok) => parseInteger(tok, flag));
}

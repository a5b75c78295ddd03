import { inputError } from '../errors';

const LIMIT = 2 ** 53;

/** A normalized tuple: distinct integers in increasing order, the first one 0 (so the last is the diameter). */
export type Offsets = readonly number[];

/**
 * Normalizes a tuple of offsets: every value must be an integer with |h| < 2^53, the values must be
 * distinct; they may come in any order. Returns them sorted increasingly and shifted so that the
 * smallest is 0 (admissibility and occupancy are invariant under translation).
 * @throws EngineError(input) for an empty tuple, a non-integer, |h| ≥ 2^53, a duplicate offset, or a
 *   diameter ≥ 2^53 (naming the offending values).
 */
export function normalizeTuple(values: ReadonlyArray<number | bigint | string>): number[] {
  if (values.length === 0) throw inputError('a tuple needs at least one offset');
  const big: bigint[] = new Array(values.length);
  for (let i = 0; i < values.length; i++) big[i] = toBigOffset(values[i]!, i);
  big.sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  const base = big[0]!;
  const out: number[] = new Array(big.length);
  for (let i = 0; i < big.length; i++) {
    if (i > 0 && big[i] === big[i - 1]) throw inputError(`duplicate offset ${big[i]} in the tuple`);
    const shifted = big[i]! - base;
    if (shifted >= BigInt(LIMIT)) {
      throw inputError(`tuple diameter ${shifted} (from ${base} to ${big[i]}) is not below 2^53`);
    }
    out[i] = Number(shifted);
  }
  return out;
}

function toBigOffset(v: number | bigint | string, index: number): bigint {
  let b: bigint;
  if (typeof v === 'bigint') b = v;
  else if (typeof v === 'number') {
    if (!Number.isInteger(v)) throw inputError(`offset #${index + 1} (${v}) is not an integer`);
    if (Math.abs(v) >= LIMIT) throw inputError(`offset #${index + 1} (${v}) has |h| ≥ 2^53`);
    b = BigInt(v);
  } else {
    const t = v.trim();
    if (!/^[+-]?\d+$/.test(t)) throw inputError(`offset #${index + 1} ("${v}") is not an integer`);
    b = BigInt(t);
  }
  if (b >= BigInt(LIMIT) || b <= -BigInt(LIMIT)) throw inputError(`offset #${index + 1} (${b}) has |h| ≥ 2^53`);
  return b;
}

/**
 * Parses a tuple written as text: integers separated by commas, spaces or new lines, in any order.
 * Blank lines and lines starting with `#` are ignored. The result is normalized ({@link normalizeTuple}).
 * @throws EngineError(input) for a token that is not an integer, or any error of {@link normalizeTuple}.
 */
export function parseTuple(text: string): number[] {
  const tokens: string[] = [];
  for (const line of text.split(/\r?\n/)) {
    const t = line.trim();
    if (t === '' || t.startsWith('#')) continue;
    for (const tok of t.split(/[\s,;]+/)) if (tok !== '') tokens.push(tok);
  }
  return normalizeTuple(tokens);
}

/** Diameter max H − min H of a tuple (any order; 0 for a single offset). */
export function tupleDiameter(offsets: Offsets): number {
  let lo = Infinity;
  let hi = -Infinity;
  for (const h of offsets) {
    if (h < lo) lo = h;
    if (h > hi) hi = h;
  }
  return offsets.length === 0 ? 0 : hi - lo;
}

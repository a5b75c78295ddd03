import { domainError, limitError, type SourceSpan, typeError } from '../errors';
import { bitLength, Rational } from '../values/rational';
import { IntRange, SiftRecord, Table, Tuple, typeName, UserFn, type Value } from '../values/types';

export type Num = bigint | Rational | number;

export function isNum(v: Value): v is Num {
  return typeof v === 'bigint' || typeof v === 'number' || v instanceof Rational;
}

export function toReal(v: Num): number {
  if (typeof v === 'number') return v;
  if (typeof v === 'bigint') return Number(v);
  return v.toNumber();
}

function parts(v: bigint | Rational): [bigint, bigint] {
  return typeof v === 'bigint' ? [v, 1n] : [v.n, v.d];
}

function needNum(v: Value, op: string, span: SourceSpan): Num {
  if (!isNum(v)) throw typeError(`'${op}' needs numbers, got ${typeName(v)}`, span);
  return v;
}

/** Refuses an integer result wider than maxBits, before it is computed when the size is known. */
export function checkBits(bits: number, maxBits: number, what: string, span: SourceSpan): void {
  if (bits > maxBits) throw limitError(`${what} would have about ${Math.round(bits)} bits; the limit is ${maxBits} bits`, span);
}

export function add(a: Value, b: Value, span: SourceSpan, sign: 1n | -1n = 1n): Num {
  const x = needNum(a, sign === 1n ? '+' : '−', span);
  const y = needNum(b, sign === 1n ? '+' : '−', span);
  if (typeof x === 'bigint' && typeof y === 'bigint') return sign === 1n ? x + y : x - y;
  if (typeof x === 'number' || typeof y === 'number') return sign === 1n ? toReal(x) + toReal(y) : toReal(x) - toReal(y);
  const [an, ad] = parts(x);
  const [bn, bd] = parts(y);
  return Rational.of(an * bd + sign * bn * ad, ad * bd);
}

/**
 * A product of integers of b1 and b2 bits has b1 + b2 − 1 or b1 + b2 bits: refused before it is
 * computed when even the smaller size is over the limit, else checked exactly once computed, so
 * the limit applies to the result's real size (the same for a^b and a^(b/2) · a^(b/2)).
 */
function checkProduct(u: bigint, v: bigint, maxBits: number, span: SourceSpan): bigint {
  if (u === 0n || v === 0n) return 0n;
  checkBits(bitLength(u) + bitLength(v) - 1, maxBits, 'the product', span);
  const p = u * v;
  checkBits(bitLength(p), maxBits, 'the product', span);
  return p;
}

export function mul(a: Value, b: Value, span: SourceSpan, maxBits: number): Num {
  const x = needNum(a, '·', span);
  const y = needNum(b, '·', span);
  if (typeof x === 'number' || typeof y === 'number') return toReal(x) * toReal(y);
  const [an, ad] = parts(x);
  const [bn, bd] = parts(y);
  const n = checkProduct(an, bn, maxBits, span);
  const d = checkProduct(ad, bd, maxBits, span);
  if (ad === 1n && bd === 1n) return n;
  return Rational.of(n, d);
}

/** log2 |x| for x ≠ 0, to double precision whatever the size of x. */
export function log2Abs(x: bigint): number {
  const ax = x < 0n ? -x : x;
  const bits = bitLength(ax);
  if (bits <= 1000) return Math.log2(Number(ax));
  const shift = bits - 64;
  return Math.log2(Number(ax >> BigInt(shift))) + shift;
}

/**
 * Bits of |n|^e: exactly ⌊e · log2|n|⌋ + 1. The estimate in double precision is exact to far
 * better than one bit below the limit (e · log2|n| ≤ 2^18 there), so only a result within one bit
 * of the limit needs computing to decide (powerBits returns the lower of the two candidates).
 */
export function powerBits(n: bigint, e: bigint): number {
  const an = n < 0n ? -n : n;
  if (an <= 1n || e === 0n) return an === 0n && e > 0n ? 0 : 1;
  return Math.floor(Number(e) * log2Abs(an) - 1e-9) + 1;
}

export function div(a: Value, b: Value, span: SourceSpan, maxBits: number): Num {
  const x = needNum(a, '/', span);
  const y = needNum(b, '/', span);
  if (typeof x === 'number' || typeof y === 'number') return toReal(x) / toReal(y);
  const [an, ad] = parts(x);
  const [bn, bd] = parts(y);
  if (bn === 0n) throw domainError('division by zero', span);
  checkBits(bitLength(an) + bitLength(bd), maxBits, 'the quotient', span);
  checkBits(bitLength(ad) + bitLength(bn), maxBits, 'the quotient', span);
  return Rational.of(an * bd, ad * bn);
}

function needInt(v: Value, op: string, span: SourceSpan): bigint {
  if (typeof v !== 'bigint') throw typeError(`'${op}' needs integers, got ${typeName(v)}`, span);
  return v;
}

/** a mod m with 0 ≤ result < |m| (the residue), as in number theory. */
export function mod(a: Value, b: Value, span: SourceSpan): bigint {
  const x = needInt(a, 'mod', span);
  const m = needInt(b, 'mod', span);
  if (m === 0n) throw domainError('mod 0 is undefined', span);
  const r = x % m;
  return r < 0n ? r + (m < 0n ? -m : m) : r;
}

/** ⌊a / m⌋ for integers. */
export function intDiv(a: Value, b: Value, span: SourceSpan): bigint {
  const x = needInt(a, 'div', span);
  const m = needInt(b, 'div', span);
  if (m === 0n) throw domainError('div by 0 is undefined', span);
  const q = x / m;
  return (x % m !== 0n && (x < 0n) !== (m < 0n)) ? q - 1n : q;
}

export function neg(a: Value, span: SourceSpan): Num {
  const x = needNum(a, '−', span);
  if (typeof x === 'bigint') return -x;
  if (typeof x === 'number') return -x;
  return Rational.of(-x.n, x.d);
}

export function pow(a: Value, b: Value, span: SourceSpan, maxBits: number): Num {
  const x = needNum(a, '^', span);
  const y = needNum(b, '^', span);
  if (typeof x === 'number' || typeof y === 'number') return Math.pow(toReal(x), toReal(y));
  if (typeof y !== 'bigint') throw typeError('an exact power needs an integer exponent; write real(x)^y for an approximate one', span);
  const [n, d] = parts(x);
  if (y < 0n && n === 0n) throw domainError('0 to a negative power is undefined', span);
  const e = y < 0n ? -y : y;
  const absN = n < 0n ? -n : n;
  if (absN > 1n || d > 1n) {
    if (e > BigInt(maxBits)) throw limitError(`the power would have more than ${maxBits} bits; the limit is ${maxBits} bits`, span);
    // Exact size of the result (not bitLength(base) · e, which took 2^131100 for 262 200 bits).
    checkBits(Math.max(powerBits(absN, e), powerBits(d, e)), maxBits, 'the power', span);
  }
  const pn = n ** e;
  const pd = d ** e;
  if (absN > 1n || d > 1n) checkBits(Math.max(bitLength(pn), bitLength(pd)), maxBits, 'the power', span);
  return y < 0n ? Rational.of(pd, pn) : d === 1n ? pn : Rational.of(pn, pd);
}

/** Numeric order: −1, 0 or 1. */
export function compareNum(a: Value, b: Value, op: string, span: SourceSpan): number {
  const x = needNum(a, op, span);
  const y = needNum(b, op, span);
  if (typeof x === 'number' || typeof y === 'number') {
    const u = toReal(x);
    const v = toReal(y);
    return u < v ? -1 : u > v ? 1 : 0;
  }
  const [an, ad] = parts(x);
  const [bn, bd] = parts(y);
  const l = an * bd;
  const r = bn * ad;
  return l < r ? -1 : l > r ? 1 : 0;
}

/** Structural equality; exact and real numbers compare by value. */
export function valuesEqual(a: Value, b: Value): boolean {
  if (isNum(a) && isNum(b)) {
    if (typeof a === 'number' || typeof b === 'number') return toReal(a) === toReal(b);
    if (typeof a === 'bigint' || typeof b === 'bigint') return a === b;
    return a.n === b.n && a.d === b.d;
  }
  if (typeof a !== 'object' || typeof b !== 'object') return a === b;
  if (a instanceof Tuple && b instanceof Tuple) return a.offsets.length === b.offsets.length && a.offsets.every((x, i) => x === b.offsets[i]);
  if (a instanceof IntRange && b instanceof IntRange) return a.lo === b.lo && a.hi === b.hi && a.primesOnly === b.primesOnly;
  if (Array.isArray(a) && Array.isArray(b)) return a.length === b.length && a.every((x, i) => valuesEqual(x, b[i]!));
  if (a instanceof SiftRecord && b instanceof SiftRecord) {
    if (a.fields.size !== b.fields.size) return false;
    for (const [k, v] of a.fields) {
      const w = b.fields.get(k);
      if (w === undefined || !valuesEqual(v, w)) return false;
    }
    return true;
  }
  if (a instanceof Table && b instanceof Table) {
    return a.columns.join('\u0000') === b.columns.join('\u0000') && valuesEqual(a.rows as Value, b.rows as Value);
  }
  if (a instanceof UserFn && b instanceof UserFn) return a === b;
  return false;
}

/** |a − b| ≤ 1e-12·max(|a|, |b|) (or both tiny): equality for approximate values. */
export function approxEqual(a: Value, b: Value, span: SourceSpan): boolean {
  const u = toReal(needNum(a, '≈', span));
  const v = toReal(needNum(b, '≈', span));
  if (u === v) return true;
  const scale = Math.max(Math.abs(u), Math.abs(v));
  return Math.abs(u - v) <= 1e-12 * (scale < 1e-300 ? 1 : scale);
}

// Binary fixed-point arithmetic on bigints: a real x is held as round(x · 2^bits).

/** 2^bits as a bigint (the fixed-point 1). */
export const fixedOne = (bits: number): bigint => 1n << BigInt(bits);

/** a·b in fixed point. */
export const fixedMul = (a: bigint, b: bigint, bits: number): bigint => (a * b) >> BigInt(bits);

/** ln(a/b) for positive integers a, b, by 2·atanh((a − b)/(a + b)) (fast when a/b is near 1). */
export function fixedLnRatio(a: bigint, b: bigint, bits: number): bigint {
  const num = a - b;
  const den = a + b;
  if (num === 0n) return 0n;
  const num2 = num * num;
  const den2 = den * den;
  let term = (fixedOne(bits) * num) / den; // z^(2j+1)
  let sum = 0n;
  for (let j = 1n; term !== 0n; j += 2n) {
    sum += term / j;
    term = (term * num2) / den2;
  }
  return 2n * sum;
}

/** ln(1 + x) for a fixed-point |x| ≤ 1/4, by its Taylor series. */
export function fixedLn1p(x: bigint, bits: number): bigint {
  let sum = 0n;
  let power = x;
  for (let j = 1n; power !== 0n; j++) {
    sum += j % 2n === 1n ? power / j : -power / j;
    power = fixedMul(power, x, bits);
  }
  return sum;
}

/** e^x for a fixed-point x with |x| ≤ 8: Taylor series after halving x 16 times, then squaring back. */
export function fixedExp(x: bigint, bits: number): bigint {
  const extra = 24;
  const b = bits + extra;
  let y = x << BigInt(extra - 16); // x / 2^16 at precision b
  const one = fixedOne(b);
  let sum = one;
  let term = one;
  for (let j = 1n; term !== 0n; j++) {
    term = fixedMul(term, y, b) / j;
    sum += term;
  }
  for (let i = 0; i < 16; i++) sum = fixedMul(sum, sum, b);
  y = sum >> BigInt(extra);
  return y;
}

/**
 * Decimal scientific form of e^L for a fixed-point L: `significant` digits, rounded, as
 * "d.ddd…e±E", plus the digits and exponent separately.
 */
export function expToDecimal(L: bigint, bits: number, significant: number): { text: string; mantissa: string; exponent: number } {
  const one = fixedOne(bits);
  const ln10 = fixedLnRatio(10n, 1n, bits);
  let E = L >= 0n ? L / ln10 : -((-L + ln10 - 1n) / ln10); // floor(L / ln 10)
  let f = L - E * ln10; // in [0, ln 10)
  let m = fixedExp(f, bits); // in [1, 10)
  if (m >= 10n * one) {
    m /= 10n;
    E += 1n;
    f -= ln10;
  }
  // Digits: floor(m · 10^(significant−1)), rounded half up.
  const scaled = m * 10n ** BigInt(significant - 1);
  let digits = (scaled + (one >> 1n)) >> BigInt(bits);
  if (digits >= 10n ** BigInt(significant)) {
    digits /= 10n;
    E += 1n;
  }
  const s = digits.toString();
  const mantissa = `${s[0]}.${s.slice(1)}`;
  const exponent = Number(E);
  return { text: `${mantissa}e${exponent >= 0 ? '+' : ''}${exponent}`, mantissa, exponent };
}

/** Exact rational n/d with d > 1 and gcd(n, d) = 1 (integers are plain bigints, never Rational). */
export class Rational {
  private constructor(
    readonly n: bigint,
    readonly d: bigint,
  ) {}

  /** n/d reduced; an integer result comes back as a bigint. Caller guarantees d ≠ 0. */
  static of(n: bigint, d: bigint): Rational | bigint {
    if (d < 0n) {
      n = -n;
      d = -d;
    }
    const g = gcd(n < 0n ? -n : n, d);
    if (g !== 1n) {
      n /= g;
      d /= g;
    }
    return d === 1n ? n : new Rational(n, d);
  }

  toString(): string {
    return `${this.n}/${this.d}`;
  }

  toNumber(): number {
    return ratioToNumber(this.n, this.d);
  }
}

export function gcd(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  if (b < 0n) b = -b;
  while (b !== 0n) [a, b] = [b, a % b];
  return a;
}

/** n/d as the nearest double, also when n and d exceed 2^1024 separately. */
export function ratioToNumber(n: bigint, d: bigint): number {
  const direct = Number(n) / Number(d);
  if (Number.isFinite(direct) && direct !== 0) return direct;
  if (n === 0n) return 0;
  const shift = BigInt(Math.max(0, bitLength(n) - 60)) - BigInt(Math.max(0, bitLength(d) - 60));
  const nn = shift > 0n ? n >> shift : n;
  const dd = shift < 0n ? d >> -shift : d;
  return (Number(nn) / Number(dd)) * 2 ** Number(shift);
}

/** Number of bits of |x| (0 for 0). */
export function bitLength(x: bigint): number {
  if (x < 0n) x = -x;
  if (x === 0n) return 0;
  const hex = x.toString(16);
  return (hex.length - 1) * 4 + (32 - Math.clz32(parseInt(hex[0]!, 16)));
}

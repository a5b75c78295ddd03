/** Gap → count, gaps in increasing order (counts are exact; they can pass 2^53 at deep levels). */
export type GapHistogram = ReadonlyMap<number, bigint>;

/**
 * Consecutive gap pattern → count. Keys are the gaps joined by commas ("2,4" means a gap 2 followed
 * by a gap 4), keys in lexicographic order of the gap sequences.
 */
export type PatternTally = ReadonlyMap<string, bigint>;

/** Index radix of the dense tallies: half-gaps 0 … 63, i.e. gaps up to 126. */
export const HALF_GAP_RADIX = 64;

/** Dense half-gap histogram (index g/2, exact counts < 2^53) → sparse bigint map. */
export function histogramFromDense(dense: ArrayLike<number>, radix = dense.length): GapHistogram {
  const out = new Map<number, bigint>();
  for (let h = 0; h < radix; h++) if (dense[h]) out.set(2 * h, BigInt(dense[h]!));
  return out;
}

/**
 * Dense pattern tally over half-gaps with the given radix (index Σ h_i·radix^(L−1−i)) → sparse map.
 * Entries with a half-gap ≥ `limit` (sentinels for "no previous gap") are skipped.
 */
export function patternsFromDense(dense: ArrayLike<number>, length: number, radix: number, limit = radix): PatternTally {
  const out = new Map<string, bigint>();
  const digits = new Array<number>(length);
  for (let idx = 0; idx < dense.length; idx++) {
    const v = dense[idx]!;
    if (!v) continue;
    let rest = idx;
    let ok = true;
    for (let i = length - 1; i >= 0; i--) {
      digits[i] = rest % radix;
      rest = Math.floor(rest / radix);
      if (digits[i]! >= limit) ok = false;
    }
    if (ok) out.set(digits.map((h) => 2 * h).join(','), BigInt(v));
  }
  return out;
}

/** Sums of consecutive pairs: T2(g) = Σ_{a+b=g} pairs(a, b). */
export function pairSums(pairs: PatternTally): GapHistogram {
  const acc = new Map<number, bigint>();
  for (const [key, v] of pairs) {
    const [a, b] = key.split(',').map(Number) as [number, number];
    acc.set(a + b, (acc.get(a + b) ?? 0n) + v);
  }
  return new Map([...acc.entries()].sort((x, y) => x[0] - y[0]));
}

/** Largest gap with a non-zero count (0 for an empty histogram). */
export function histogramMaxGap(h: GapHistogram): number {
  let m = 0;
  for (const [g, v] of h) if (v > 0n && g > m) m = g;
  return m;
}

import { inputError, limitError } from '../errors';
import { primesUpTo } from '../primes/small-primes';
import { wheelGaps } from '../wheel/level-gaps';
import { checkLevel, nextPrime, previousPrime, productTree } from '../wheel/primorial';

/** One term c·∏_{from ≤ q ≤ p} (q − shift) of a closed form. */
export interface ProductTerm {
  readonly coefficient: bigint;
  readonly shift: number;
}

/**
 * A count as a function of the level p: Σ c_s·∏_{from ≤ q ≤ p, q prime} (q − s), valid for every
 * level p ≥ validFrom (an empty product is 1). For a consecutive pattern, s = |H| is the size of the
 * sub-tuple H of the inclusion–exclusion (so s = 1 + j in the notation ∏(q − 1 − j)).
 */
export interface ClosedForm {
  /** the consecutive gaps counted, e.g. [6] or [2, 4] */
  readonly pattern: readonly number[];
  /** first prime of the products */
  readonly from: number;
  /** least level at which the formula holds */
  readonly validFrom: number;
  /** terms with non-zero coefficients, by increasing shift */
  readonly terms: readonly ProductTerm[];
  /** e.g. "2·∏(q−2) − 2·∏(q−3)" */
  readonly text: string;
  /** e.g. "∏ over primes 5 ≤ q ≤ p, valid for p ≥ 3" */
  readonly range: string;
}

/** Bound on inclusion–exclusion nodes (admissible sub-tuples) visited for one pattern. */
export const INCLUSION_EXCLUSION_NODE_LIMIT = 2e8;

/** Largest span (sum of the gaps) accepted by the inclusion–exclusion. */
export const MAX_PATTERN_SPAN = 120;

/**
 * Checks a consecutive gap pattern: a non-empty list of positive integers with span ≤ 120.
 * @throws EngineError(input) otherwise.
 */
export function checkPattern(gaps: readonly number[]): void {
  if (gaps.length === 0) throw inputError('a gap pattern needs at least one gap');
  for (const g of gaps) if (!Number.isSafeInteger(g) || g <= 0) throw inputError(`gap ${g} is not a positive integer`);
  const span = gaps.reduce((a, b) => a + b, 0);
  if (span > MAX_PATTERN_SPAN) throw limitError(`pattern span ${span} is above ${MAX_PATTERN_SPAN}`);
}

/**
 * Inclusion–exclusion over the interior positions of a consecutive pattern with admissibility
 * pruning. The pattern (g_1 … g_m) at level p occurs at x when x + H0 (H0 = partial sums, starting
 * at 0) are members and no other member lies in (x, x + D): count = Σ_{S ⊆ interior} (−1)^{|S|}
 * N_p(H0 ∪ S), N_p(H) = ∏_{q ≤ p}(q − ν_q(H)). Odd offsets make N vanish (mod 2), so only even
 * interior offsets are tried; a sub-tuple covering every residue mod a prime q ≤ `upTo` vanishes
 * with all its supersets (pruned). Returns per size s = |H| the sum of ±∏_{3 ≤ q ≤ upTo}(q − ν_q),
 * exact bigints.
 */
function signedSums(gaps: readonly number[], upTo: number): Map<number, bigint> {
  const H0 = [0];
  for (const g of gaps) H0.push(H0[H0.length - 1]! + g);
  const D = H0[H0.length - 1]!;
  const out = new Map<number, bigint>();
  if (H0.some((h) => h % 2 !== 0)) return out; // an odd offset: ν_2 = 2, every term vanishes
  const inH0 = new Set(H0);
  const cands: number[] = [];
  for (let t = 2; t < D; t += 2) if (!inH0.has(t)) cands.push(t);
  const qs = Array.from(primesUpTo(upTo)).filter((q) => q >= 3);
  const Q = qs.length;
  const counts = qs.map((q) => new Int32Array(q));
  const nu = new Int32Array(Q);
  const resid = cands.map((t) => qs.map((q) => t % q));
  for (const h of H0) {
    for (let i = 0; i < Q; i++) if (counts[i]![h % qs[i]!]!++ === 0) nu[i]!++;
  }
  for (let i = 0; i < Q; i++) if (nu[i] === qs[i]) return out;
  const sizeMax = H0.length + cands.length;
  const acc = new Float64Array(sizeMax + 1);
  const big: bigint[] = new Array(sizeMax + 1).fill(0n);
  let nodes = 0;
  const visit = (start: number, sign: number, size: number): void => {
    if (++nodes > INCLUSION_EXCLUSION_NODE_LIMIT) {
      throw limitError(`inclusion–exclusion for pattern ${gaps.join(',')} exceeds ${INCLUSION_EXCLUSION_NODE_LIMIT} sub-tuples`);
    }
    let prod = sign;
    for (let i = 0; i < Q; i++) prod *= qs[i]! - nu[i]!;
    if (Math.abs(prod) >= 2 ** 52) {
      // 14 or more primes (spans ≥ 94): the product can pass 2^53, where doubles round; redo it exactly
      let exact = BigInt(sign);
      for (let i = 0; i < Q; i++) exact *= BigInt(qs[i]! - nu[i]!);
      big[size] = big[size]! + exact;
    } else {
      const a = acc[size]! + prod; // |prod| < 2^52, |acc| ≤ 2^52: the sum is exact
      if (Math.abs(a) > 2 ** 52) {
        big[size] = big[size]! + BigInt(a);
        acc[size] = 0;
      } else acc[size] = a;
    }
    for (let c = start; c < cands.length; c++) {
      const r = resid[c]!;
      let full = false;
      for (let i = 0; i < Q; i++) {
        if (counts[i]![r[i]!]!++ === 0 && ++nu[i]! === qs[i]) full = true;
      }
      if (!full) visit(c + 1, -sign, size + 1);
      for (let i = 0; i < Q; i++) if (--counts[i]![r[i]!]! === 0) nu[i]!--;
    }
  };
  visit(0, 1, H0.length);
  for (let s = 0; s <= sizeMax; s++) {
    const v = big[s]! + BigInt(acc[s]!);
    if (v !== 0n) out.set(s, v);
  }
  return out;
}

/** "2·∏(q−2) − 2·∏(q−3)" from terms. */
export function formatClosedForm(terms: readonly ProductTerm[]): string {
  if (terms.length === 0) return '0';
  return terms
    .map((t, i) => {
      const neg = t.coefficient < 0n;
      const abs = neg ? -t.coefficient : t.coefficient;
      const body = `${abs === 1n ? '' : `${abs}·`}∏(q−${t.shift})`;
      return i === 0 ? (neg ? `−${body}` : body) : `${neg ? ' − ' : ' + '}${body}`;
    })
    .join('');
}

/**
 * Closed form of the number of occurrences of a consecutive gap pattern in one period of level p,
 * exact for every level p ≥ validFrom: Σ_s c_s·∏_{r ≤ q ≤ p}(q − s) where r is the least odd prime
 * above D/2 (D = sum of the gaps) — for q ≥ r every sub-tuple meets |H| distinct residues — and the
 * constants c_s carry the factors of the primes 3 ≤ q < r. validFrom is the prime before r.
 * Example: gap 6 → 2·∏(q−2) − 2·∏(q−3) over primes 5 ≤ q ≤ p (OEIS A271564).
 * @throws EngineError(input) for a bad pattern; EngineError(limit) for a span above 120 or too many sub-tuples.
 */
export function patternClosedForm(gaps: readonly number[]): ClosedForm {
  checkPattern(gaps);
  const key = gaps.join(',');
  const hit = formCache.get(key);
  if (hit) return hit;
  const form = buildClosedForm(gaps);
  if (formCache.size > 512) formCache.clear();
  formCache.set(key, form);
  return form;
}

const formCache = new Map<string, ClosedForm>();

/** Drops the cached closed forms (benchmarks measure each count from a cold cache). */
export function clearClosedFormCache(): void {
  formCache.clear();
}

function buildClosedForm(gaps: readonly number[]): ClosedForm {
  const D = gaps.reduce((a, b) => a + b, 0);
  const r = Math.max(3, nextPrime(Math.floor(D / 2)));
  const validFrom = Math.max(2, previousPrime(r));
  const sums = signedSums(gaps, r - 1);
  const terms = [...sums.entries()].sort((a, b) => a[0] - b[0]).map(([shift, coefficient]) => ({ shift, coefficient }));
  return {
    pattern: [...gaps],
    from: r,
    validFrom,
    terms,
    text: formatClosedForm(terms),
    range: `∏ over primes ${r} ≤ q ≤ p (empty product = 1), valid for p ≥ ${validFrom}`,
  };
}

/** Closed form of the number of gaps equal to g in one period of level p (see {@link patternClosedForm}). */
export function gapClosedForm(g: number): ClosedForm {
  return patternClosedForm([g]);
}

/**
 * Value of a closed form at level p: Σ c_s·∏_{from ≤ q ≤ p}(q − s).
 * @throws EngineError(input) when p is not a prime, or p < validFrom (the formula is not claimed there).
 */
export function evaluateClosedForm(form: ClosedForm, p: number): bigint {
  checkLevel(p);
  if (p < form.validFrom) throw inputError(`closed form of pattern ${form.pattern.join(',')} holds for levels p ≥ ${form.validFrom}, not ${p}`);
  const primes = Array.from(primesUpTo(p)).filter((q) => q >= form.from);
  let total = 0n;
  for (const t of form.terms) total += t.coefficient * productTree(primes.map((q) => BigInt(q - t.shift)));
  return total;
}

/**
 * Exact number of occurrences of the consecutive gap pattern in one period [1, p#] of level p
 * (occurrence at member x: x, x + g_1, … are consecutive members). Uses the closed form when
 * p ≥ validFrom, otherwise the inclusion–exclusion restricted to the primes ≤ p (p ≥ 3; for spans
 * above 60 at levels ≤ 13, whose pruning is weak, a walk of the tiny cycle); level 2 directly.
 * @throws EngineError as {@link patternClosedForm} and for a level that is not a prime ≤ 10^6.
 */
export function patternCount(gaps: readonly number[], p: number): bigint {
  checkPattern(gaps);
  checkLevel(p);
  if (p === 2) return gaps.every((g) => g === 2) ? 1n : 0n;
  const form = patternClosedForm(gaps);
  if (p >= form.validFrom) return evaluateClosedForm(form, p);
  const D = gaps.reduce((a, b) => a + b, 0);
  if (p <= 13 && D > 60) return cyclicCount(gaps, p); // weak pruning at tiny levels: walk the cycle
  const sums = signedSums(gaps, p);
  let total = 0n;
  for (const v of sums.values()) total += v;
  return total;
}

/** Exact number of gaps equal to g in one period of level p (see {@link patternCount}). */
export function gapCount(g: number, p: number): bigint {
  return patternCount([g], p);
}

/** Occurrences in one period of a small level (≤ 13#, at most 5760 gaps) by walking its cycle. */
function cyclicCount(gaps: readonly number[], p: number): bigint {
  const cycle = wheelGaps(p);
  const n = cycle.length;
  let count = 0;
  outer: for (let i = 0; i < n; i++) {
    for (let k = 0; k < gaps.length; k++) if (cycle[(i + k) % n] !== gaps[k]) continue outer;
    count++;
  }
  return BigInt(count);
}

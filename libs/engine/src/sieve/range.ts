import { inputError, limitError } from '../errors';
import { sieveCore } from './core';
import { kernelFits, sieveCoreWasm } from './core-wasm';
import type { SieveKernel } from './kernel';
import { compilePattern, type CompiledPattern } from './pattern';
import type { PrimeBlock } from './prime-block';
import type { WorkHooks } from './progress';
import { SIEVE_MAX_TO, sievingPrimesFor } from './sieving-primes';
import { forEachPrimeBetween } from './walk';

export { SIEVE_MAX_TO };

/** What to compute besides π: gap statistics and constellation patterns. */
export interface SieveOptions {
  /** Gap histogram and record gaps (costs a pass over every prime). Default false. */
  readonly gaps?: boolean;
  /** Constellation patterns H (each any order, normalized to start at 0; must be admissible). */
  readonly patterns?: ReadonlyArray<ReadonlyArray<number | bigint | string>>;
}

/**
 * Which inner loops sieve: an instantiated WebAssembly kernel (`@cribra/engine/node` loads one per
 * thread) or, when absent, the JavaScript reference sieve. Ranges ending at or above 2^40 and
 * patterns too large for the kernel's memory always take the JavaScript sieve.
 */
export interface KernelOption {
  readonly kernel?: SieveKernel;
}

/** A range end given as bigint, safe integer or decimal string. */
export type RangeEnd = bigint | number | string;

/**
 * Reads a range [from, to] of non-negative integers with to ≤ SIEVE_MAX_TO.
 * @throws EngineError(input) for a non-integer end or from > to; EngineError(limit) for to > 10^15.
 */
export function parseSieveRange(from: RangeEnd, to: RangeEnd): { from: bigint; to: bigint } {
  const f = toBig(from, 'from');
  const t = toBig(to, 'to');
  if (f < 0n) throw inputError(`range start ${f} is negative`);
  if (f > t) throw inputError(`empty range: from ${f} is above to ${t}`);
  if (t > SIEVE_MAX_TO) throw limitError(`range end ${t} is above the sieve limit ${SIEVE_MAX_TO}`);
  return { from: f, to: t };
}

function toBig(v: RangeEnd, name: string): bigint {
  if (typeof v === 'bigint') return v;
  if (typeof v === 'number') {
    if (!Number.isSafeInteger(v)) throw inputError(`range ${name} ${v} is not a safe integer (pass a bigint or a string)`);
    return BigInt(v);
  }
  const s = v.trim();
  const m = /^(\d+)(?:e(\d+))?$/i.exec(s);
  if (!m) throw inputError(`range ${name} "${v}" is not a non-negative integer`);
  return BigInt(m[1]!) * 10n ** BigInt(m[2] ?? '0');
}

/**
 * Sieves the range [from, to] and returns its combinable summary: π over the range, first and last
 * prime, optionally the gap histogram and record gaps, and for each pattern H the number of n with
 * n + h prime for every h ∈ H, n ≥ from and n + max H ≤ to, with the first and last such n.
 * Segmented sieve of Eratosthenes on the mod-30 wheel; time about (to − from)·log log to, memory
 * O(√to / log to). The options may carry {@link WorkHooks}: with `onProgress`, reports the fraction sieved every few segments (about
 * 6·10^7 integers) and 1 at the end; `shouldStop` is polled at the same points.
 * @throws EngineError(input) for a malformed range or pattern, EngineError(domain) for a
 *   non-admissible pattern, EngineError(limit) for to > 10^15 or when `shouldStop` answers true.
 */
export function sievePrimeBlock(from: RangeEnd, to: RangeEnd, options: SieveOptions & WorkHooks & KernelOption = {}): PrimeBlock {
  const range = parseSieveRange(from, to);
  const compiled = (options.patterns ?? []).map((p) => compilePattern(p));
  return sieveCompiled(range.from, range.to, compiled, options.gaps ?? false, options, options.kernel);
}

/** {@link sievePrimeBlock} on a checked range with compiled patterns. */
export function sieveCompiled(
  from: bigint,
  to: bigint,
  compiled: readonly CompiledPattern[],
  gaps: boolean,
  hooks?: WorkHooks,
  kernel?: SieveKernel,
): PrimeBlock {
  const a = Number(from);
  const b = Number(to);
  const sieving = sievingPrimesFor(b);
  const h = hooks?.onProgress || hooks?.shouldStop ? hooks : undefined;
  const core =
    (kernel && kernelFits(b) ? sieveCoreWasm(kernel, a, b, compiled, gaps, sieving, h) : null) ?? sieveCore(a, b, compiled, gaps, sieving, h);
  const window = compiled.reduce((w, cp) => Math.max(w, cp.diameter), 0);
  let headPrimes: number[] = [];
  let tailPrimes: number[] = [];
  if (window > 0) {
    const head = core.windows?.head ?? primesInShortRange(a, Math.min(b, a + window - 1));
    const tail = core.windows?.tail ?? primesInShortRange(Math.max(a, b - window + 1), b);
    headPrimes = head.map((p) => p - a);
    tailPrimes = tail.map((p) => b - p).reverse();
  }
  const big = (v: number): bigint | null => (v < 0 ? null : BigInt(v));
  let gapStats: PrimeBlock['gaps'] = null;
  if (core.gaps) {
    const histogram = new Map<number, number>();
    core.gaps.histogram.forEach((c, g) => {
      if (c > 0) histogram.set(g, c);
    });
    gapStats = { histogram, records: core.gaps.records.map((r) => ({ gap: r.gap, after: BigInt(r.after) })) };
  }
  return {
    from,
    to,
    primeCount: core.primeCount,
    firstPrime: big(core.firstPrime),
    lastPrime: big(core.lastPrime),
    gaps: gapStats,
    patterns: compiled.map((cp, i) => ({
      pattern: cp.offsets,
      count: core.patterns[i]!.count,
      first: big(core.patterns[i]!.first),
      last: big(core.patterns[i]!.last),
    })),
    window,
    headPrimes,
    tailPrimes,
  };
}

/** The primes in [lo, hi] (a short interval), in increasing order. */
function primesInShortRange(lo: number, hi: number): number[] {
  const out: number[] = [];
  forEachPrimeBetween(lo, hi, (p) => {
    out.push(p);
  });
  return out;
}

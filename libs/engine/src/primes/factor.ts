import { inputError, limitError } from '../errors';
import { checkStop, type WorkHooks } from '../sieve/progress';
import { gcd } from './gcd';
import { isPrime } from './is-prime';
import { primesUpTo } from './small-primes';

/**
 * Largest n {@link factorInteger} accepts: 10^24, below ψ13 ≈ 3.3·10^24, so that every factor it
 * returns is proven prime by {@link isPrime}; the hardest such n (two 12-digit primes) take about
 * 10^6 steps of Pollard's rho.
 */
export const FACTOR_MAX = 10n ** 24n;

/** Trial divisors: the primes below 2^12 (the rest is left to Pollard's rho). */
const TRIAL_PRIMES = Array.from(primesUpTo(1 << 12), (p) => BigInt(p));

/** Rho steps between two polls of the stop hook. */
const STEPS_PER_POLL = 1 << 14;

/**
 * The prime factorisation of 1 ≤ n ≤ 10^24 as [prime, exponent] pairs in increasing order of the
 * primes (n = 1 gives none): trial division by the primes below 4096, then Pollard's rho with
 * Brent's cycle detection and batched gcds on what is left, each factor split until
 * {@link isPrime} proves it prime. Expected time about n^(1/4) steps for the hardest n.
 * `hooks.shouldStop` is polled every 16 384 rho steps.
 * @throws EngineError(input) for n < 1; EngineError(limit) for n > 10^24 or when stopped.
 */
export function factorInteger(n: bigint, hooks?: WorkHooks): Array<[bigint, number]> {
  if (n < 1n) throw inputError(`factorInteger: ${n} is not a positive integer`);
  if (n > FACTOR_MAX) throw limitError(`factorInteger: ${n} is above the limit 10^24`);
  const exponents = new Map<bigint, number>();
  const add = (p: bigint, e: number): void => {
    exponents.set(p, (exponents.get(p) ?? 0) + e);
  };
  for (const p of TRIAL_PRIMES) {
    if (p * p > n) break;
    let e = 0;
    while (n % p === 0n) {
      n /= p;
      e++;
    }
    if (e > 0) add(p, e);
  }
  // What is left has no prime factor below 4096: it is 1, a prime, or a product of larger primes.
  const pending = n > 1n ? [n] : [];
  while (pending.length > 0) {
    const m = pending.pop()!;
    if (isPrime(m)) {
      add(m, 1);
      continue;
    }
    const d = rhoDivisor(m, hooks);
    pending.push(d, m / d);
  }
  return [...exponents.entries()].sort((x, y) => (x[0] < y[0] ? -1 : 1));
}

/** A proper divisor of the composite m (odd, no factor below 4096): Pollard's rho, Brent's variant. */
function rhoDivisor(m: bigint, hooks: WorkHooks | undefined): bigint {
  const what = `factoring ${m}`;
  let steps = 0;
  for (let c = 1n; ; c++) {
    const f = (x: bigint): bigint => (x * x + c) % m;
    let y = 2n;
    let x = y;
    let q = 1n;
    let g = 1n;
    let ys = y;
    // Brent: x is fixed for r steps of y; gcds of the product of |x − y| every 128 steps.
    for (let r = 1; g === 1n; r *= 2) {
      x = y;
      for (let i = 0; i < r; i++) y = f(y);
      for (let k = 0; k < r && g === 1n; k += 128) {
        ys = y;
        const batch = Math.min(128, r - k);
        for (let i = 0; i < batch; i++) {
          y = f(y);
          q = (q * (x > y ? x - y : y - x)) % m;
        }
        g = gcd(q, m);
        steps += batch;
        if (steps >= STEPS_PER_POLL) {
          steps = 0;
          checkStop(hooks, what);
        }
      }
    }
    if (g === m) {
      // The batch overshot: step through it one by one.
      do {
        ys = f(ys);
        g = gcd(x > ys ? x - ys : ys - x, m);
      } while (g === 1n);
    }
    if (g !== m) return g;
    // The cycle closed modulo every factor at once: try another polynomial.
  }
}

// Independent reference methods for the sieve tests: trial division and Miller–Rabin (no sieve code).

let table: number[] = [];

/** The primes ≤ 10^6 by trial division (built once). */
function smallPrimeTable(): number[] {
  if (table.length > 0) return table;
  const out: number[] = [2];
  for (let n = 3; n <= 1_000_000; n += 2) {
    let prime = true;
    for (const p of out) {
      if (p * p > n) break;
      if (n % p === 0) {
        prime = false;
        break;
      }
    }
    if (prime) out.push(n);
  }
  table = out;
  return out;
}

/** Primality by trial division for n < 10^12. */
export function isPrimeByTrialDivision(n: number): boolean {
  if (n < 2) return false;
  for (const p of smallPrimeTable()) {
    if (p * p > n) return true;
    if (n % p === 0) return n === p;
  }
  if (n >= 1e12) throw new Error(`trial division reference limited to n < 10^12, got ${n}`);
  return true;
}

/** Primes in [a, b] by trial division. */
export function naivePrimes(a: number, b: number): number[] {
  const out: number[] = [];
  for (let n = Math.max(a, 2); n <= b; n++) if (isPrimeByTrialDivision(n)) out.push(n);
  return out;
}

/** Deterministic Miller–Rabin for n < 3.3·10^24 (bases: the primes up to 41), on bigints. */
export function isPrimeMillerRabin(n: bigint): boolean {
  if (n < 2n) return false;
  const bases = [2n, 3n, 5n, 7n, 11n, 13n, 17n, 19n, 23n, 29n, 31n, 37n, 41n];
  for (const p of bases) if (n % p === 0n) return n === p;
  let d = n - 1n;
  let s = 0;
  while (d % 2n === 0n) {
    d /= 2n;
    s++;
  }
  const powmod = (b: bigint, e: bigint): bigint => {
    let r = 1n;
    b %= n;
    while (e > 0n) {
      if (e & 1n) r = (r * b) % n;
      b = (b * b) % n;
      e >>= 1n;
    }
    return r;
  };
  for (const a of bases) {
    let x = powmod(a, d);
    if (x === 1n || x === n - 1n) continue;
    let composite = true;
    for (let i = 1; i < s; i++) {
      x = (x * x) % n;
      if (x === n - 1n) {
        composite = false;
        break;
      }
    }
    if (composite) return false;
  }
  return true;
}

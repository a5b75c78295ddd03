/** The first 13 primes: the strong-pseudoprime bases of {@link isPrime}. */
const BASES = [2n, 3n, 5n, 7n, 11n, 13n, 17n, 19n, 23n, 29n, 31n, 37n, 41n];

function powMod(b: bigint, e: bigint, m: bigint): bigint {
  let r = 1n;
  b %= m;
  while (e > 0n) {
    if (e & 1n) r = (r * b) % m;
    b = (b * b) % m;
    e >>= 1n;
  }
  return r;
}

/**
 * Primality of a bigint: Miller–Rabin with the first 13 prime bases (2 … 41). Below
 * 3.3·10^24 (ψ13 = 3 317 044 064 679 887 385 961 981, Sorenson–Webster 2015) the answer is a proof;
 * above that it is a strong probable-prime test. Values below 2 are not prime. Never throws.
 */
export function isPrime(n: bigint): boolean {
  if (n < 2n) return false;
  for (const p of BASES) {
    if (n === p) return true;
    if (n % p === 0n) return false;
  }
  let d = n - 1n;
  let s = 0;
  while ((d & 1n) === 0n) {
    d >>= 1n;
    s++;
  }
  outer: for (const a of BASES) {
    let x = powMod(a, d, n);
    if (x === 1n || x === n - 1n) continue;
    for (let i = 1; i < s; i++) {
      x = (x * x) % n;
      if (x === n - 1n) continue outer;
    }
    return false;
  }
  return true;
}

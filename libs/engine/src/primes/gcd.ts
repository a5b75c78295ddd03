/** Greatest common divisor of two bigints (non-negative; gcd(0, 0) = 0). Internal to the engine. */
export function gcd(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  if (b < 0n) b = -b;
  while (b !== 0n) [a, b] = [b, a % b];
  return a;
}

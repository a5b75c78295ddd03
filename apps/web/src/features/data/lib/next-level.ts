import type { WheelLevelSummary } from '@cribra/contracts';

/**
 * The smallest prime above every level asked for so far (2 when none): the next level to request.
 * A cancelled level counts as not asked for, so it is offered again.
 */
export function nextLevelPrime(levels: WheelLevelSummary[]): number {
  const top = levels.filter((l) => l.status !== 'cancelled').reduce((m, l) => Math.max(m, l.prime), 1);
  for (let n = top + 1; ; n++) {
    let prime = n > 1;
    for (let d = 2; d * d <= n; d++) if (n % d === 0) { prime = false; break; }
    if (prime) return n;
  }
}

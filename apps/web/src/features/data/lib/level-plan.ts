import { MAX_STORED_LEVEL, SPLIT_ROUTE_FROM } from '@cribra/contracts';

/**
 * What the runners will do for level p, in a sentence for the Data page (the runner decides the
 * chunk count; the route and what is stored follow from the level), or null when p cannot be stored.
 */
export function levelPlan(p: number): string | null {
  if (p > MAX_STORED_LEVEL) return null;
  if (p <= 23) return `Level ${p}: the gap cycle enumerated in one piece, with tallies of 2 and 3 consecutive gaps.`;
  if (p < SPLIT_ROUTE_FROM) return `Level ${p}: by the histogram and pair recursions, in chunks; pair tallies stored.`;
  const base = p >= 47 ? 23 : 19; // as the engine's defaultSplitBase, which the runners use
  return `Level ${p}: by the split route — chunks of the members of ${base}#, each adding counts of every gap; the histogram only, checked by Σ counts = φ(${p}#) and Σ gap·count = ${p}#.`;
}

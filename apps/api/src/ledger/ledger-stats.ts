import { LEDGER_CONSTELLATIONS, type GapCount, type RecordGap } from '@cribra/contracts';
import type { PrimeBlockJson } from '@cribra/engine';

/** Histogram object → sorted list of {gap, count}. */
export function gapCounts(histogram: Record<string, number> | undefined | null): GapCount[] {
  return Object.entries(histogram ?? {})
    .map(([gap, count]) => ({ gap: Number(gap), count: String(count) }))
    .sort((a, b) => a.gap - b.gap);
}

/** Counts of the named constellations, matched by pattern. */
export function constellationCounts(block: PrimeBlockJson): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [name, pattern] of Object.entries(LEDGER_CONSTELLATIONS)) {
    const found = block.patterns.find((p) => p.pattern.join(',') === pattern.join(','));
    if (found) out[name] = String(found.count);
  }
  return out;
}

export function recordGaps(block: PrimeBlockJson): RecordGap[] {
  return (block.gaps?.records ?? []).map((r) => ({ gap: r.gap, start: r.after }));
}

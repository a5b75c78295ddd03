import { COSTS, type ComputationView } from '@cribra/contracts';

/** Expected time of a ledger request of `blocks` blocks not yet stored, from the measured cost per block. */
export const estimateLedgerMs = (blocks: number): number => blocks * COSTS.ledgerBlockMs;

/**
 * Expected time of wheel level `prime`, from measured whole levels (31, 37 request → stored; 41, 43,
 * 47 by the split route's bench, see COSTS). Levels below 31 take about a second.
 */
export function estimateLevelMs(prime: number): number {
  return prime < 31 ? 1_000 : (COSTS.levelMs[prime] ?? 1_000);
}

/** "45 s", "3 min 05 s", "2 h 36 min". */
export function formatDuration(ms: number): string {
  const s = Math.max(0, Math.round(ms / 1000));
  if (s < 60) return `${s} s`;
  const m = Math.floor(s / 60);
  if (m < 60) return `${m} min ${String(s % 60).padStart(2, '0')} s`;
  return `${Math.floor(m / 60)} h ${String(m % 60).padStart(2, '0')} min`;
}

export interface ProgressFigures {
  done: number;
  total: number;
  elapsedMs: number;
  /** Time left at the pace so far; null before the first chunk is done. */
  leftMs: number | null;
}

/** Done of total, time since a runner started it, and the time left at the pace so far. */
export function progressFigures(c: ComputationView, now: number): ProgressFigures {
  const start = Date.parse(c.startedAt ?? c.createdAt);
  const end = c.finishedAt ? Date.parse(c.finishedAt) : now;
  const elapsedMs = Math.max(0, end - start);
  const leftMs = c.chunksDone > 0 && c.chunksTotal > 0 ? (elapsedMs / c.chunksDone) * (c.chunksTotal - c.chunksDone) : null;
  return { done: c.chunksDone, total: c.chunksTotal, elapsedMs, leftMs };
}

import type { ComputationView } from '@cribra/contracts';
import { describe, expect, it } from 'vitest';
import { estimateLedgerMs, estimateLevelMs, formatDuration, progressFigures } from './estimate';

const c = (over: Partial<ComputationView>): ComputationView => ({
  id: 'c', kind: 'ledger', params: {}, status: 'running', chunksTotal: 100, chunksDone: 25, requestedBy: null,
  createdAt: '2026-12-04T10:00:00.000Z', startedAt: '2026-12-04T10:00:10.000Z', finishedAt: null, error: null, ...over,
});

describe('estimates and progress', () => {
  it('estimates from the measured costs', () => {
    expect(estimateLedgerMs(100)).toBe(8_300);
    expect(estimateLedgerMs(1000)).toBeGreaterThan(60_000);
    expect(estimateLevelMs(29)).toBeLessThan(60_000);
    expect(estimateLevelMs(37)).toBe(261_000);
    // by the split route: seconds, no confirmation asked
    expect(estimateLevelMs(41)).toBe(3_000);
    expect(estimateLevelMs(47)).toBeLessThan(60_000);
  });

  it('gives elapsed time from the start and the time left at the pace so far', () => {
    const f = progressFigures(c({}), Date.parse('2026-12-04T10:00:30.000Z'));
    expect(f).toEqual({ done: 25, total: 100, elapsedMs: 20_000, leftMs: 60_000 });
    expect(progressFigures(c({ chunksDone: 0 }), Date.parse('2026-12-04T10:00:30.000Z')).leftMs).toBeNull();
  });

  it('writes durations for people', () => {
    expect(formatDuration(45_000)).toBe('45 s');
    expect(formatDuration(185_000)).toBe('3 min 05 s');
    expect(formatDuration(261_000 * 36)).toBe('2 h 36 min');
  });
});

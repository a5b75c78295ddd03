import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { narrowTuple } from '../narrow';
import { admissibility } from '../tuple';
import { narrowSearchParallel } from './narrow-parallel';

describe('narrow search on worker threads', () => {
  it('2 workers: admissible (tuple module), never wider than narrowTuple, best-so-far reports only narrower tuples', async () => {
    const reports: number[] = [];
    const r = await narrowSearchParallel(300, { seconds: 3, workers: 2, onBest: (t) => reports.push(t.diameter) });
    expect(r.baseline).toBe(narrowTuple(300).diameter);
    expect(r.diameter).toBeLessThanOrEqual(r.baseline);
    expect(r.exact).toBe(false);
    expect(r.pieces).toBeGreaterThanOrEqual(2);
    expect(admissibility(r.tuple)).toMatchObject({ admissible: true, k: 300, diameter: r.diameter });
    for (let i = 1; i < reports.length; i++) expect(reports[i]).toBeLessThan(reports[i - 1]);
    expect(reports[reports.length - 1]).toBe(r.diameter);
  }, 60_000);

  it('is exact at once for k ≤ 100 (H(20) = 80, OEIS A008407)', async () => {
    expect(await narrowSearchParallel(20, { seconds: 100, workers: 2 })).toMatchObject({ diameter: 80, exact: true, pieces: 0 });
  });

  it('stops the workers when cancelled', async () => {
    const controller = new AbortController();
    const t0 = Date.now();
    const run = narrowSearchParallel(2000, { seconds: 120, workers: 2, signal: controller.signal });
    setTimeout(() => controller.abort(), 300);
    await expect(run).rejects.toThrow(/cancelled/);
    expect(Date.now() - t0).toBeLessThan(30_000);
  }, 60_000);

  it('rejects bad input before starting workers', async () => {
    await expect(narrowSearchParallel(0, { seconds: 1 })).rejects.toThrow(EngineError);
    await expect(narrowSearchParallel(300, { seconds: 0 })).rejects.toThrow(/search time/);
    await expect(narrowSearchParallel(300, { seconds: 1, workers: 0 })).rejects.toThrow(/worker count/);
  });
});

import { describe, expect, it } from 'vitest';
import { splitHistograms } from '../counts/split-counts';
import { cycleHistogramAndPairSums } from '../wheel/scan';
import { wheelGaps } from '../wheel/level-gaps';
import { splitHistogramsParallel } from './split-pool';

describe('split pool (worker threads)', () => {
  it('shares the base members of 11# between 2 workers: 17# and 19# equal the enumeration and the one-thread route', async () => {
    let calls = 0;
    const { histograms, result } = await splitHistogramsParallel([17, 19], { workers: 2, base: 11, chunksPerWorker: 3, onProgress: () => calls++ });
    expect(calls).toBe(6);
    expect([result.from, result.to]).toEqual([0, 480]); // every member of 11# (φ(11#) = 480, OEIS A005867)
    for (const p of [17, 19]) expect(histograms.get(p)).toEqual(cycleHistogramAndPairSums(wheelGaps(p)).histogram);
    expect(histograms).toEqual(splitHistograms([17, 19], 11));
  });
  it('refuses bad levels before starting workers', async () => {
    await expect(splitHistogramsParallel([53], { workers: 2 })).rejects.toThrow(/above the limit 47/);
  });
});

import { describe, expect, it } from 'vitest';
import { patternsFromDense } from '../wheel/tally';
import { scanGapCycle } from '../wheel/scan';
import { wheelGaps } from '../wheel/level-gaps';
import { planWheelChunks } from '../wheel/chunk';
import { runWheelChunksParallel, streamLevelParallel, wheelLevelStatsParallel } from './wheel-pool';

describe('wheel pool (worker threads)', () => {
  it('streams 19# over 17# on 2 workers and matches the in-memory scan (histogram, quadruples, first positions)', async () => {
    let calls = 0;
    const t = await streamLevelParallel(19, 4, { workers: 2, chunksPerWorker: 3, firstPositions: true, onProgress: () => calls++ });
    const scan = scanGapCycle(wheelGaps(19), [4]);
    expect(calls).toBe(6);
    expect(t.maxGap).toBe(34);
    for (const [g, v] of scan.histogram) expect(BigInt(t.histogram[g / 2]!)).toBe(v);
    for (const [g, m] of scan.firstPosition) expect(t.firstPosition[g / 2]).toBe(m);
    expect(patternsFromDense(t.patterns!, 4, t.radix + 1, t.radix)).toEqual(scan.patterns.get(4));
  });
  it('level statistics of an in-memory level come from the scan; bad lengths are refused', async () => {
    expect((await wheelLevelStatsParallel(13, [2])).patterns.get(2)!.get('2,4')).toBe(scanGapCycle(wheelGaps(13), [2]).patterns.get(2)!.get('2,4'));
    await expect(wheelLevelStatsParallel(29, [5])).rejects.toThrow(/pattern length 5/);
  });
  it('reports a failing chunk as an EngineError naming it', async () => {
    const specs = planWheelChunks(13, 17, 2, 1).map((s) => ({ ...s, radix: 4 })); // gaps above 6 do not fit
    await expect(runWheelChunksParallel(specs, { workers: 2 })).rejects.toThrow(/chunk 17# copies \[(0, 8|8, 17)\): gap \d+ at level 17 is above the tally bound 6/);
  });
});

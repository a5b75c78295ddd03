import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { primeBlockToJson, sievePrimeBlock } from '../sieve';
import { closeSieveWorkers, idleSieveWorkers, sievePrimeBlockParallel } from './sieve-parallel';

describe('parallel sieve over worker threads', () => {
  it('equals the one-pass block (π, gaps, patterns) on 2 workers', async () => {
    const options = { gaps: true, patterns: [[0, 2], [0, 2, 6, 8], [0, 4, 6, 10, 12, 16]] };
    const progress: number[] = [];
    const parallel = await sievePrimeBlockParallel(1_000_000, 61_000_000, {
      ...options,
      workers: 2,
      blocks: 7,
      onProgress: (done) => progress.push(done),
    });
    expect(primeBlockToJson(parallel)).toEqual(primeBlockToJson(sievePrimeBlock(1_000_000, 61_000_000, options)));
    expect(progress).toEqual([1, 2, 3, 4, 5, 6, 7]);
  });
  it('counts π(10^8) = 5761455 (OEIS A006880) with the default split', async () => {
    expect((await sievePrimeBlockParallel(0, '1e8', { workers: 2 })).primeCount).toBe(5761455);
  });
  it('reuses its workers across calls, and starts new ones after a cancel or a closed pool', async () => {
    const twins = async () => (await sievePrimeBlockParallel(0, '1e8', { workers: 2, patterns: [[0, 2]] })).patterns[0]!.count;
    // 440 312 twin pairs below 10^8 (OEIS A007508), three times: fresh, reused, and after closing.
    expect(await twins()).toBe(440312);
    expect(idleSieveWorkers()).toBe(2);
    expect(await twins()).toBe(440312);
    expect(idleSieveWorkers()).toBe(2); // the same two again, not two more
    const controller = new AbortController();
    const run = sievePrimeBlockParallel(0, '1e11', { workers: 2, signal: controller.signal });
    setTimeout(() => controller.abort(), 100);
    await expect(run).rejects.toThrow(/cancelled/);
    expect(idleSieveWorkers()).toBe(0); // the cancelled call's workers were stopped, not kept
    expect(await twins()).toBe(440312);
    await closeSieveWorkers();
    expect(idleSieveWorkers()).toBe(0);
    expect(await twins()).toBe(440312);
    expect(idleSieveWorkers()).toBe(2);
  });
  it('stops the workers when cancelled', async () => {
    const controller = new AbortController();
    const run = sievePrimeBlockParallel(0, '1e11', { workers: 2, signal: controller.signal });
    setTimeout(() => controller.abort(), 200);
    await expect(run).rejects.toThrow(/cancelled/);
  });
  it('rejects bad input before starting workers', async () => {
    await expect(sievePrimeBlockParallel(0, 100, { patterns: [[0, 2, 4]] })).rejects.toThrow(EngineError);
    await expect(sievePrimeBlockParallel(0, 100, { workers: 0 })).rejects.toThrow(/worker count 0/);
    await expect(sievePrimeBlockParallel(5, 1)).rejects.toThrow(/empty range/);
  });
});

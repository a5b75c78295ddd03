import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { compareWithHardyLittlewood, hardyLittlewoodCrossings } from '../hl';
import { narrowTuple } from '../narrow';
import { gapHistogram, histogramFromDense, streamLevel } from '../wheel';
import { countPrimes } from './queries';
import { sievePrimeBlock } from './range';

/** Collects the reports of one call. */
function recorder() {
  const reports: Array<[number, string | undefined]> = [];
  return { reports, onProgress: (f: number, m?: string) => reports.push([f, m]) };
}

function expectIncreasingToOne(reports: ReadonlyArray<[number, string | undefined]>, atLeast: number): void {
  expect(reports.length).toBeGreaterThanOrEqual(atLeast);
  for (let i = 1; i < reports.length; i++) expect(reports[i]![0]).toBeGreaterThan(reports[i - 1]![0]);
  expect(reports[0]![0]).toBeGreaterThan(0);
  expect(reports.at(-1)![0]).toBe(1);
}

describe('progress and stop hooks of long engine calls', () => {
  it('the segmented sieve reports increasing fractions ending at 1, with the same result as without hooks', () => {
    const r = recorder();
    const withHooks = sievePrimeBlock(0, 300_000_000, { gaps: true, patterns: [[0, 2]], onProgress: r.onProgress, shouldStop: () => false });
    // 3·10^8 integers are about 19 segments: a report every 4 segments and one at the end.
    expectIncreasingToOne(r.reports, 4);
    expect(r.reports.every(([, m]) => m === 'sieving [0, 300000000]')).toBe(true);
    expect(withHooks).toEqual(sievePrimeBlock(0, 300_000_000, { gaps: true, patterns: [[0, 2]] }));
  });

  it('countPrimes passes the hooks on; π(10^8) = 5761455 (OEIS A006880)', () => {
    const r = recorder();
    expect(countPrimes(0, 100_000_000, r)).toBe(5_761_455);
    expectIncreasingToOne(r.reports, 2);
  });

  it('stops the sieve when shouldStop answers true, and lets an error of the caller through', () => {
    let polls = 0;
    const stop = () => ++polls >= 2;
    expect(() => sievePrimeBlock(0, 10n ** 12n, { shouldStop: stop })).toThrow(EngineError);
    expect(polls).toBe(2);
    let stopped: unknown = null;
    try {
      sievePrimeBlock(0, 10n ** 12n, { shouldStop: () => true });
    } catch (e) {
      stopped = e;
    }
    expect(stopped).toBeInstanceOf(EngineError);
    expect(stopped).toMatchObject({ kind: 'limit', message: 'stopped on request while sieving [0, 1000000000000]' });
    const own = new Error('time is up');
    expect(() => compareWithHardyLittlewood([0, 2], 10n ** 12n, { shouldStop: () => { throw own; } })).toThrow(own);
  });

  it('Hardy–Littlewood crossings report progress over [0, to] and give the same result', () => {
    const r = recorder();
    const withHooks = hardyLittlewoodCrossings([0, 2], { from: 2, to: 1_000_000, step: 1000, onProgress: r.onProgress });
    expectIncreasingToOne(r.reports, 100);
    expect(withHooks).toEqual(hardyLittlewoodCrossings([0, 2], { from: 2, to: 1_000_000, step: 1000 }));
    // Steps longer than a few segments pass the hooks down to the sieve of each step.
    const long = recorder();
    hardyLittlewoodCrossings([0, 2], { from: 2, to: 130_000_000, step: 65_000_000, onProgress: long.onProgress });
    expectIncreasingToOne(long.reports, 4);
    expect(() => hardyLittlewoodCrossings([0, 2], { to: 10n ** 9n, step: 1000, shouldStop: () => true })).toThrow(/stopped on request/);
  });

  it('streaming a wheel level reports once per chunk and gives the same histogram', () => {
    const r = recorder();
    const t = streamLevel(19, 1, undefined, undefined, false, r);
    expectIncreasingToOne(r.reports, 19);
    expect(r.reports[0]![1]).toBe('streaming level 19');
    expect(histogramFromDense(t.histogram)).toEqual(gapHistogram(19));
    expect(() => streamLevel(19, 1, undefined, undefined, false, { shouldStop: () => true })).toThrow(/stopped on request while streaming level 19/);
  });

  it('the narrow-tuple construction reports its stages', () => {
    const r = recorder();
    const t = narrowTuple(300, r);
    expectIncreasingToOne(r.reports, 5);
    expect(t.k).toBe(300);
    expect(() => narrowTuple(300, { shouldStop: () => true })).toThrow(/stopped on request/);
  });
});

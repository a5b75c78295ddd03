import { describe, expect, it } from 'vitest';
import { evaluate } from '../src';

/** A stop check that answers true from its n-th poll on. */
function stopAfter(n: number) {
  let polls = 0;
  return () => ++polls >= n;
}

describe('progress and stop inside long builtins (in-process)', () => {
  it('hlcheck reports the sieve progress under a message naming the range and pattern', () => {
    const progress: Array<[number, string]> = [];
    const r = evaluate('hlcheck({0, 2}, 3·10^8).actual', { onProgress: (f, m) => progress.push([f, m]) });
    expect(r.error).toBeNull();
    const sieving = progress.filter(([, m]) => m === 'hlcheck: sieving 0 … 3·10^8 for {0, 2}');
    expect(sieving.length).toBeGreaterThanOrEqual(4);
    for (let i = 1; i < sieving.length; i++) expect(sieving[i]![0]).toBeGreaterThan(sieving[i - 1]![0]);
    expect(sieving.at(-1)![0]).toBe(1);
  });

  it('a cancel stops a ledger inside the engine sieve, at the call', () => {
    const started = Date.now();
    const r = evaluate('let x = 1\nledger(1..10^12)', { shouldStop: stopAfter(4) });
    expect(r.error).toMatchObject({ kind: 'cancelled', message: 'the run was cancelled', line: 2, column: 1 });
    expect(Date.now() - started).toBeLessThan(2_000);
  });

  it('the time limit stops a single long engine call', () => {
    const r = evaluate('records(1..10^12)', { limits: { maxMillis: 300 } });
    expect(r.error).toMatchObject({ kind: 'limit', message: 'the time limit (0.3 s) was reached' });
    expect(r.millis).toBeLessThan(1_500);
  });

  it('streaming a deep wheel level reports per chunk and stops on cancel', () => {
    const progress: Array<[number, string]> = [];
    const r = evaluate('firstpositions(29)', { shouldStop: stopAfter(4), onProgress: (f, m) => progress.push([f, m]) });
    expect(r.error).toMatchObject({ kind: 'cancelled' });
    const chunks = progress.filter(([f, m]) => m === 'firstpositions: scanning level 29 for first positions' && f > 0);
    expect(chunks.length).toBeGreaterThanOrEqual(1);
  });
});

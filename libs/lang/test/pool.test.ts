import { afterAll, describe, expect, it } from 'vitest';
import { evaluate, MemoryDataProvider } from '../src';
import { SiftPool } from '../src/node';

// Workers run the built dist (the libs project builds it before the tests).
const pool = new SiftPool({ threads: 2, limits: { maxMillis: 20_000 } });
afterAll(() => pool.close());

const CELL = `let H = {0, 2, 6, 8}
table[p ∈ primes 5..19](level: p, hits: hits(H, p), sixes: gapcount(6, p))
show ∑[n ∈ 1..20] 1/n
claim gapcount(6, p) = closedform(6, p) over p ∈ primes 5..19`;

describe('the worker pool', () => {
  it('gives the same outputs and digest as an in-process run, in every thread', async () => {
    const local = evaluate(CELL);
    const runs = await Promise.all([1, 2, 3, 4].map(() => pool.run(CELL)));
    for (const r of runs) {
      expect(r.error).toBeNull();
      expect(r.outputs).toEqual(local.outputs);
      expect(r.digest).toBe(local.digest);
    }
  });

  it('cancels a long cell', async () => {
    const ac = new AbortController();
    const started = Date.now();
    const progress: number[] = [];
    setTimeout(() => ac.abort(), 400);
    const r = await pool.run('∑[n ∈ 1..10^12] n^2', { signal: ac.signal, limits: { maxSteps: 1e13 }, onProgress: (f) => progress.push(f) });
    expect(r.error).toEqual({ kind: 'cancelled', message: 'the run was cancelled' });
    expect(Date.now() - started).toBeLessThan(3_000);
    // The pool still works after a worker was stopped.
    expect((await pool.run('1 + 1')).outputs[0]).toMatchObject({ text: '2' });
  });

  it('cancels a long builtin mid-way, once it has reported progress', async () => {
    const ac = new AbortController();
    let abortedAt = 0;
    const progress: number[] = [];
    const r = await pool.run('ledger(1..10^12)', {
      signal: ac.signal,
      onProgress: (f) => {
        progress.push(f);
        if (f > 0 && abortedAt === 0) {
          abortedAt = Date.now();
          ac.abort();
        }
      },
    });
    expect(r.error).toEqual({ kind: 'cancelled', message: 'the run was cancelled' });
    expect(abortedAt).toBeGreaterThan(0);
    expect(progress.at(-1)!).toBeLessThan(1);
    expect(Date.now() - abortedAt).toBeLessThan(1_500);
  });

  it('reports progress of a ledger from inside the engine sieve', async () => {
    const progress: Array<[number, string]> = [];
    const r = await pool.run('ledger(1..4·10^8).primes', { onProgress: (f, m) => progress.push([f, m]) });
    expect(r.error).toBeNull();
    // π(4·10^8) = 21336326 (OEIS A006880 gives π at powers of 10; this value from memory).
    expect(r.outputs[0]).toMatchObject({ text: '21336326' });
    const sieving = progress.filter(([, m]) => m === 'ledger: sieving 1 … 4·10^8');
    expect(sieving.length).toBeGreaterThanOrEqual(5);
    for (let i = 1; i < sieving.length; i++) expect(sieving[i]![0]).toBeGreaterThan(sieving[i - 1]![0]);
    expect(sieving.at(-1)![0]).toBe(1);
    expect(progress.at(-1)).toEqual([1, 'done']);
  });

  it('reports progress of a long claim', async () => {
    const progress: Array<[number, string]> = [];
    const r = await pool.run('claim isprime(p) over p ∈ primes 2..300000', { onProgress: (f, m) => progress.push([f, m]) });
    expect(r.error).toBeNull();
    expect(progress.length).toBeGreaterThan(10);
    expect(progress.some(([, m]) => m.startsWith('p = '))).toBe(true);
    expect(progress.at(-1)).toEqual([1, 'done']);
    expect(progress.every(([f], i) => i === 0 || f >= progress[i - 1]![0] || f === 1)).toBe(true);
  });

  it('stops a run at the time limit', async () => {
    const r = await pool.run('∑[n ∈ 1..10^12] n', { limits: { maxMillis: 500, maxSteps: 1e13 } });
    expect(r.error).toMatchObject({ kind: 'limit', message: 'the time limit (0.5 s) was reached' });
  });

  it('stops a worker that exceeds its heap with a limit error', async () => {
    const small = new SiftPool({ threads: 1, limits: { maxHeapMb: 48, maxMillis: 30_000, maxSteps: 1e9 } });
    try {
      const r = await small.run('let s = [10^2000 + k : k ∈ 1..400000]\nsize(s)');
      expect(r.error).toEqual({ kind: 'limit', message: 'the memory limit (48 MB) was reached' });
    } finally {
      await small.close();
    }
  });

  it('reads stored data from the host through the bridge', async () => {
    const data = new MemoryDataProvider()
      .addLevel({ prime: 37, modulus: 7420738134810n, phi: 1279935820800n, largestGap: 66, histogram: [{ gap: 2, count: 5n }], patternTallies: [] })
      .addUpload('q', { kind: 'tuples', values: [0n, 2n, 6n, 8n, 12n] });
    const r = await pool.run('gapcount(2, 37)\nadmissible(upload("q"))\nisstored(41)', { data: data.asProvider() });
    expect(r.error).toBeNull();
    expect(r.outputs.map((o) => (o.kind === 'value' ? o.text : o.kind))).toEqual(['5', 'true', 'false']);
  });

  it('turns a failing host provider into a domain error', async () => {
    const r = await pool.run('upload("x")', {
      data: { level: async () => null, ledger: async () => null, upload: async () => { throw new Error('database is down'); } },
    });
    expect(r.error).toMatchObject({ kind: 'domain', message: 'stored data unavailable: database is down' });
  });
});

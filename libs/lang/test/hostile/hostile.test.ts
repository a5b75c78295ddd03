import { afterAll, describe, expect, it } from 'vitest';
import type { RunResult } from '../../src';
import { SiftPool } from '../../src/node';
import { loadCorpus } from './corpus';

// Tight limits, so the corpus stays cheap in CI; each program must still end in the typed error
// its header names, well within the wall-clock limit plus the pool's hard-stop grace.
const LIMITS = { maxMillis: 3_000, maxSteps: 2_000_000, maxHeapMb: 64 };
const GRACE_MS = 3_000;
const THREADS = 2;

const corpus = loadCorpus();
const pool = new SiftPool({ threads: THREADS, limits: LIMITS });
afterAll(() => pool.close());

interface Outcome {
  result: RunResult;
  ms: number;
}

// Runs the whole corpus once, at most THREADS at a time, so each run's wall time is its own.
const outcomes: Promise<Map<string, Outcome>> = (async () => {
  const out = new Map<string, Outcome>();
  const queue = [...corpus];
  await Promise.all(
    Array.from({ length: THREADS }, async () => {
      for (let p = queue.shift(); p; p = queue.shift()) {
        const started = Date.now();
        const result = await pool.run(p.source);
        out.set(p.name, { result, ms: Date.now() - started });
      }
    }),
  );
  return out;
})();

describe('hostile cells through the worker pool', () => {
  it('the corpus has at least 40 programs covering every kind of attack', () => {
    expect(corpus.length).toBeGreaterThanOrEqual(40);
    for (const prefix of ['range-', 'tower-', 'power-', 'literal-', 'nesting-', 'line', 'confusable-', 'table-', 'series-', 'recursion-', 'claim-']) {
      expect(corpus.some((p) => p.name.startsWith(prefix)), prefix).toBe(true);
    }
    const longest = corpus.reduce((m, p) => p.source.split('\n').reduce((n, l) => Math.max(n, l.length), m), 0);
    expect(longest).toBeGreaterThanOrEqual(1_000_000);
  });

  it.each(corpus.map((p) => [p.name, p] as const))('%s ends in its typed error within the limits', async (_name, p) => {
    const o = (await outcomes).get(p.name)!;
    expect(o.result.ok, p.why).toBe(false);
    expect(o.result.error, p.why).toMatchObject({ kind: p.expect, message: expect.any(String) });
    // A clear, short message (no stack trace, no megabyte echo of the source).
    expect(o.result.error!.message.length).toBeLessThan(300);
    expect(o.result.error!.message).not.toMatch(/\n\s+at /);
    expect(o.result.error!.message).not.toMatch(/Maximum call stack|internal error/);
    expect(o.ms).toBeLessThan(LIMITS.maxMillis + GRACE_MS);
  }, 60_000);

  it('the pool still answers a normal cell afterwards', async () => {
    await outcomes;
    const r = await pool.run('admissible({0, 2, 6, 8, 12})');
    expect(r.error).toBeNull();
    expect(r.outputs[0]).toMatchObject({ kind: 'value', text: 'true' });
  });
});

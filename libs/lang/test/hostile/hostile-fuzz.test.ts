import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { evaluate, SIFT_ERROR_KINDS } from '../../src';

// The parser/interpreter fuzz test (../fuzz.test.ts) draws small expressions; this one draws the
// sizes of the corpus's attacks instead — tower heights, range ends, nesting depths, literal
// exponents, table shapes — and checks that every run ends, typed, within its time limit.
const LIMITS = { maxMillis: 400, maxSteps: 300_000, maxElements: 100_000 };
const BUDGET_MS = 3_000; // the 400 ms limit plus room for a loaded CI machine
const KINDS = new Set<string>(SIFT_ERROR_KINDS);

const big = fc.oneof(fc.integer({ min: 0, max: 40 }).map((k) => `10^${k}`), fc.bigInt({ min: 0n, max: 10n ** 30n }).map(String));
const depth = fc.integer({ min: 1, max: 6_000 });

const attack = fc.oneof(
  fc.array(fc.integer({ min: 2, max: 12 }), { minLength: 2, maxLength: 7 }).map((xs) => xs.join('^')),
  fc.tuple(big, big).map(([a, b]) => `∑[n ∈ ${a}..${b}] n`),
  fc.tuple(big, fc.constantFrom('p mod 4 = 1', 'p > 0')).map(([b, body]) => `#[p ∈ primes 1..${b}] ${body}`),
  fc.tuple(big, big).map(([a, b]) => `table[x ∈ 1..${a}, y ∈ 1..${b}](x: x, y: y)`),
  fc.tuple(big).map(([b]) => `claim n ≥ 0 over n ∈ 1..${b}`),
  depth.map((d) => `${'('.repeat(d)}1${')'.repeat(d)}`),
  depth.map((d) => `${'['.repeat(d)}1${']'.repeat(d)}`),
  depth.map((d) => `${'-'.repeat(d)}1`),
  fc.integer({ min: 0, max: 2_000_000_000 }).map((k) => `1e${k}`),
  fc.tuple(fc.integer({ min: 1, max: 400 }), fc.integer({ min: 1, max: 3 })).map(([n, w]) =>
    [`let f0(x) = x`, ...Array.from({ length: n }, (_, i) => `let f${i + 1}(x) = ${Array.from({ length: w }, () => `f${i}(x)`).join(' + ')}`), `f${n}(1)`].join('\n'),
  ),
  fc.integer({ min: 1, max: 300_000 }).map((n) => `let x = ${'1 + '.repeat(n)}1`),
  fc.tuple(fc.integer({ min: 2, max: 100_000 }), fc.constantFrom('!', '#')).map(([n, op]) => `${n}${op}`),
);

describe('fuzzing attack sizes', () => {
  it('every drawn attack ends in a result or a typed error within its time limit (400 inputs)', () => {
    const seen = new Map<string, number>();
    fc.assert(
      fc.property(attack, (source) => {
        const started = Date.now();
        const r = evaluate(source, { limits: LIMITS });
        const ms = Date.now() - started;
        if (r.error && !KINDS.has(r.error.kind)) throw new Error(`untyped ${r.error.kind} on ${source.slice(0, 80)}: ${r.error.message}`);
        if (ms > BUDGET_MS) throw new Error(`${ms} ms on ${source.slice(0, 80)}`);
        const k = r.error?.kind ?? 'ok';
        seen.set(k, (seen.get(k) ?? 0) + 1);
      }),
      { numRuns: 400, seed: 2026 },
    );
    expect(seen.get('limit') ?? 0).toBeGreaterThan(100);
    expect(seen.get('ok') ?? 0).toBeGreaterThan(10);
  }, 120_000);
});

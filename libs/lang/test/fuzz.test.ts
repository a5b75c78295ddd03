import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { evaluate, parse, SIFT_ERROR_KINDS } from '../src';

// Small limits keep every input fast; the property is that nothing escapes as a crash or an
// untyped error, whatever the text.
const LIMITS = { maxSteps: 20_000, maxMillis: 100, maxElements: 5_000, maxBits: 4_096, maxCallDepth: 20 };
const KINDS = new Set<string>(SIFT_ERROR_KINDS);

const atoms = [
  '0', '1', '2', '7', '30', '1e3', '0.5', '-3', '"s"', 'true', 'false', 'x', 'y', 'H', 'n',
  '{0, 2, 6}', '{0, 2, 4}', '[1, 2, 3]', '1..9', 'primes 2..50', '(a: 1, b: 2)', '7#', '5!',
];
// Builtins whose engine work is bounded by small arguments (the long-running ones — sieving,
// exhaustive searches, deep levels — are covered by the limit and pool tests).
const functions = [
  'admissible', 'occupancy', 'diameter', 'witness', 'hits', 'size', 'sum', 'min', 'max', 'sort',
  'isprime', 'totient', 'normalize', 'diffs', 'tuple', 'series', 'first', 'text', 'obstruction',
  'singular', 'covered', 'real', 'floor', 'gcd', 'lcm', 'wheelsize', 'shift', 'abs', 'num', 'nosuch',
];
const numbers = ['0', '1', '2', '3', '5', '7', '11', '1/2', 'n', 'n', 'x'];
const arith = [' + ', ' - ', ' * ', ' mod ', ' ^ '];
const binary = [' + ', ' - ', ' * ', ' / ', ' ^ ', ' mod ', ' div ', ' = ', ' ≠ ', ' < ', ' ≤ ', ' ≈ ', ' ∈ ', ' and ', ' or ', '..'];

const expr: fc.Arbitrary<string> = fc.letrec<{ e: string }>((tie) => ({
  e: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    fc.constantFrom(...atoms),
    fc.constantFrom(...numbers),
    fc.constantFrom(...numbers),
    fc.tuple(tie('e'), fc.constantFrom(...binary), tie('e')).map(([a, o, b]) => `(${a})${o}(${b})`),
    fc.tuple(fc.constantFrom(...numbers), fc.constantFrom(...arith), tie('e')).map(([a, o, b]) => `${a}${o}${b}`),
    fc.tuple(fc.constantFrom(...functions), fc.array(tie('e'), { maxLength: 3 })).map(([f, a]) => `${f}(${a.join(', ')})`),
    tie('e').map((e) => `(${e})`),
    tie('e').map((e) => `-${e}`),
    tie('e').map((e) => `not (${e})`),
    fc.tuple(tie('e'), tie('e')).map(([a, b]) => `[${a} : n ∈ ${b}]`),
    fc.tuple(tie('e'), tie('e')).map(([a, b]) => `{${a} : n ∈ ${b}}`),
    fc.tuple(fc.constantFrom('∑', '∏', '∀', '∃', '#', 'table'), tie('e'), tie('e')).map(([op, d, b]) => `${op}[n ∈ ${d}] ${op === 'table' ? `(v: ${b})` : b}`),
    fc.tuple(tie('e'), tie('e'), tie('e')).map(([c, a, b]) => `if ${c} then ${a} else ${b}`),
    fc.tuple(tie('e'), tie('e')).map(([a, i]) => `${a}[${i}]`),
    tie('e').map((e) => `${e}.a`),
  ),
})).e;

const statement = fc.oneof(
  expr,
  expr,
  expr.map((e) => `let v = ${e}\nv`),
  expr.map((e) => `∑[m ∈ 1..10^9] #[k ∈ 1..m] (${e}) = k`),
  expr.map((e) => `2^(10^(${e}))`),
  fc.tuple(expr, expr).map(([a, b]) => `let f(n) = ${a}\nf(${b})`),
  fc.tuple(expr, expr).map(([a, b]) => `claim ${a} over n ∈ ${b}`),
  fc.tuple(expr, expr).map(([a, b]) => `show ${a} as "v" digits ${b.length % 40}`),
  expr.map((e) => `draw line table[n ∈ 1..3](n: n, v: ${e}): n -> v`),
);

// Each statement is its own cell after a few definitions (y stays unknown on purpose).
const program = statement.map((s) => `let x = 2\nlet H = {0, 2, 6}\nlet n = 5\n${s}`);

// Raw text over the characters Sift uses, so that lexing and layout also meet garbage.
const noise = fc.string({ unit: fc.constantFrom(...'()[]{}.,:;#!^*/+-=<>≤≥≠≈∈∑∏∀∃→·−"\\ \n\tabcfxyznp0123456789_elt'.split('')), maxLength: 80 });

const seen = new Map<string, number>();

function check(source: string): void {
  let r;
  try {
    r = evaluate(source, { limits: LIMITS });
  } catch (e) {
    throw new Error(`evaluate threw on ${JSON.stringify(source)}: ${(e as Error).stack}`);
  }
  if (r.error && !KINDS.has(r.error.kind)) throw new Error(`untyped ${r.error.kind} error on ${JSON.stringify(source)}: ${r.error.message}`);
  if (r.error && 'line' in r.error && r.error.line !== undefined) {
    expect(r.error.line).toBeGreaterThanOrEqual(1);
  }
  expect(typeof r.digest).toBe('string');
  const k = r.error ? r.error.kind : 'ok';
  seen.set(k, (seen.get(k) ?? 0) + 1);
}

describe('fuzzing the parser and interpreter', () => {
  it('generated programs: no crash, only typed errors (5000 inputs)', () => {
    seen.clear();
    fc.assert(fc.property(program, check), { numRuns: 5000, seed: 20261201 });
    // The generator must reach the interpreter, not only the parser: many programs run to the
    // end, and every error kind a run can meet appears.
    expect(seen.get('ok') ?? 0).toBeGreaterThan(500);
    for (const kind of ['syntax', 'type', 'domain', 'limit']) expect(seen.get(kind) ?? 0, kind).toBeGreaterThan(0);
  }, 120_000);

  it('raw text: no crash, only typed errors (5000 inputs)', () => {
    fc.assert(fc.property(noise, (s) => {
      check(s);
      const p = parse(s);
      for (const e of p.errors) expect(KINDS.has(e.kind)).toBe(true);
    }), { numRuns: 5000, seed: 4 });
  }, 120_000);
});

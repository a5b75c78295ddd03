import { describe, expect, it } from 'vitest';
import { evaluate } from '../src';

// Each hostile cell must end in a typed limit error, well inside the time limit of the run.
const LIMITS = { maxMillis: 10_000 };

function limited(source: string, extra: object = {}) {
  const started = Date.now();
  const r = evaluate(source, { limits: { ...LIMITS, ...extra } });
  const ms = Date.now() - started;
  expect(r.error, source.slice(0, 60)).not.toBeNull();
  expect(r.error!.kind).toBe('limit');
  expect(ms).toBeLessThan(LIMITS.maxMillis);
  return { error: r.error!, ms };
}

describe('limits end hostile cells with typed errors', () => {
  it('an enormous range stops at the step limit', () => {
    const { error } = limited('∑[n ∈ 1..10^30] n', { maxSteps: 2_000_000 });
    expect(error.message).toBe('the step limit (2000000 steps) was reached');
    expect(error).toMatchObject({ line: 1 });
  });

  it('an enormous prime range stops too', () => {
    expect(limited('#[p ∈ primes 1..10^14] p mod 4 = 1', { maxSteps: 1_000_000 }).error.message).toContain('step limit');
  });

  it('a huge exponent is refused before it is computed', () => {
    const { error, ms } = limited('2^(10^9)');
    expect(error.message).toBe('the power would have more than 262144 bits; the limit is 262144 bits');
    expect(ms).toBeLessThan(1000);
    expect(limited('(10^1000)^1000').error.message).toContain('bits');
    expect(limited('100000!').error.message).toContain('bits');
    expect(limited('(10^7)#').error.message).toContain('bits');
  });

  it('repeated squaring meets the size limit', () => {
    expect(limited('let a = 3^(2^16)\nlet b = a·a\nlet c = b·b\nc·c').error.message).toContain('bits');
  });

  it('deep nesting is refused by the parser, without recursion overflow', () => {
    const deep = `${'('.repeat(5000)}1${')'.repeat(5000)}`;
    expect(limited(deep).error).toMatchObject({ kind: 'limit', message: 'brackets nest deeper than 64 levels', line: 1, column: 65 });
    expect(limited(`${'-'.repeat(10_000)}1`).error.message).toBe('more than 64 operators in a row');
    expect(limited(`${'{'.repeat(3000)}`).error.kind).toBe('limit');
  });

  it('a long flat expression evaluates without deep recursion', () => {
    const r = evaluate(Array.from({ length: 20_000 }, () => '1').join(' + '));
    expect(r.error).toBeNull();
    expect(r.outputs[0]).toMatchObject({ text: '20000' });
  });

  it('a 1 MB line is refused', () => {
    const line = `let x = ${'1 + '.repeat(262_144)}1`;
    expect(line.length).toBeGreaterThan(1_000_000);
    const { error, ms } = limited(line);
    expect(error.message).toBe(`the cell has ${line.length} characters; at most 200000 are accepted`);
    expect(ms).toBeLessThan(500);
  });

  it('a table that would not fit in memory is refused before it is built', () => {
    const { error, ms } = limited('table[n ∈ 1..10^12](n: n, square: n^2)');
    expect(error.message).toBe('this would build about 1000000000000 elements; a series, tuple or table may hold at most 1000000');
    expect(ms).toBeLessThan(500);
    expect(limited('table[a ∈ 1..10^4, b ∈ 1..10^4](a: a, b: b)').error.message).toContain('at most 1000000');
    expect(limited('[n : n ∈ 1..10^9]').error.message).toContain('at most 1000000');
  });

  it('a series that grows past the element limit stops while it grows', () => {
    expect(limited('let r = 1..(10^7)\n[n : n ∈ r, n > 0]', { maxElements: 100_000 }).error.message).toContain('at most 100000');
  });

  it('the wall-clock limit stops a long loop', () => {
    const { error, ms } = limited('∑[n ∈ 1..10^12] n^3', { maxMillis: 300, maxSteps: 1e12 });
    expect(error.message).toBe('the time limit (0.3 s) was reached');
    expect(ms).toBeLessThan(2000);
  });

  it('user functions cannot recurse, and nested calls are bounded', () => {
    const chain = ['let f0(x) = x + 1', ...Array.from({ length: 150 }, (_, i) => `let f${i + 1}(x) = f${i}(x)`), 'f150(0)'].join('\n');
    expect(limited(chain).error.message).toBe('function calls nest deeper than 100');
  });

  it('a long interval of real primes respects the range limit', () => {
    expect(limited('ledger(1..10^16)').error.message).toBe('ledger: ranges end at 10^15 at most');
  });

  it('levels too deep to compute in a cell are refused', () => {
    expect(limited('gaps(53)').error.message).toContain('level 53 is not stored, and the engine computes gap histograms up to level 47');
  });
});

describe('the size limit is exact and the same for a power and a product (262 144 bits)', () => {
  const ok = (source: string) => {
    const r = evaluate(source, { limits: LIMITS });
    expect(r.error, source).toBeNull();
    return r;
  };
  it('accepts powers up to the limit, measured by the result itself', () => {
    // 2^131100 has 131 101 bits (used to be refused as "about 262 200 bits").
    ok('let x = 2^131100\nshow 1');
    // 2^262143 has exactly 262 144 bits: the limit itself; 2^262144 has one bit more.
    ok('let x = 2^262143\nshow 1');
    expect(limited('2^262144').error.message).toBe('the power would have about 262145 bits; the limit is 262144 bits');
    // 3^150000 has ⌊150000 · log2 3⌋ + 1 bits (237 745, counted here from the number itself; the
    // old estimate said 300 000): accepted.
    expect((3n ** 150000n).toString(2).length).toBe(237_745);
    ok('let x = 3^150000\nshow 1');
  });
  it('refuses a^b and a^(b/2) · a^(b/2) alike', () => {
    ok('let x = 2^131071 · 2^131072\nshow 1'); // 2^262143: 262 144 bits
    expect(limited('2^131072 · 2^131072').error.message).toBe('the product would have about 262145 bits; the limit is 262144 bits');
    expect(limited('let h = 3^82700\nh · h').error.message).toBe(limited('3^165400').error.message.replace('power', 'product'));
    ok('let h = 3^82000\nshow h · h = 3^164000');
  });
});

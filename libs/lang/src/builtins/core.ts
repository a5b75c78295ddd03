import { FACTOR_MAX, factorInteger } from '@cribra/engine';
import { domainError, limitError, typeError } from '../errors';
import * as A from '../runtime/arithmetic';
import { forEachPrime, isPrime } from '../runtime/primes';
import { formatValue } from '../values/format';
import { bitLength, gcd, Rational } from '../values/rational';
import { IntRange, SiftRecord, Table, Tuple, typeName, type Value } from '../values/types';
import {
  argInt, argNum, argRecord, argSeries, argString, argTable, argTuple, type Builtin, type CallContext, defineBuiltins, oldSpelling,
} from './registry';

const cmp = (a: Value, b: Value, ctx: CallContext) => A.compareNum(a, b, 'order', ctx.span);

function numbersOf(args: Value[], ctx: CallContext, fn: string): Value[] {
  const s = args.length === 1 ? args[0]! : args;
  if (Array.isArray(s)) return s;
  if (s instanceof Tuple) return s.offsets;
  throw typeError(`${fn} needs a series (or several numbers), got ${typeName(s)}`, ctx.span);
}

function toSeries(v: Value, ctx: CallContext, fn: string): Value[] {
  if (Array.isArray(v)) return v;
  if (v instanceof Tuple) return v.offsets;
  if (v instanceof IntRange) {
    const out: Value[] = [];
    if (v.primesOnly) {
      forEachPrime(v.lo, v.hi, ctx.span, (p) => {
        ctx.tick();
        out.push(p);
        if (out.length > ctx.limits.maxElements) throw limitError(`${fn}: more than ${ctx.limits.maxElements} elements`, ctx.span);
      });
    } else {
      if (v.span > BigInt(ctx.limits.maxElements)) throw limitError(`${fn}: the range has ${v.span} elements; at most ${ctx.limits.maxElements}`, ctx.span);
      for (let x = v.lo; x <= v.hi; x++) out.push(x);
      ctx.tick(out.length);
    }
    return out;
  }
  if (v instanceof Table) return v.rows.map((r) => new SiftRecord(new Map(v.columns.map((c, i) => [c, r[i]!]))));
  throw typeError(`${fn} needs a series, tuple or range, got ${typeName(v)}`, ctx.span);
}

function intSqrt(n: bigint): bigint {
  if (n < 2n) return n;
  let x = BigInt(Math.floor(Math.sqrt(Number(n))));
  while (x * x > n) x--;
  while ((x + 1n) * (x + 1n) <= n) x++;
  return x;
}

/** Prime factorisation by the engine (n ≤ 10^24; the run's limits stop a long one). */
function factorize(n: bigint, ctx: CallContext, fn: string): Array<[bigint, number]> {
  if (n > FACTOR_MAX) throw limitError(`${fn}: factoring is limited to n ≤ 10^24`, ctx.span);
  return factorInteger(n, ctx.work(`factoring ${n}`));
}

const core: Builtin[] = [
  // ---------------------------------------------------------------- numbers
  {
    name: 'prime', area: 'numbers', minArgs: 1, maxArgs: 1, yieldsToCellNames: true,
    signature: 'prime(n) → boolean', doc: 'Whether n is prime (a proof below 3.3·10^24, a strong probable-prime test above).',
    example: { source: 'prime(2^61 - 1)', result: 'true' },
    call: (a, c) => primeTest(a, c, 'prime'),
  },
  {
    name: 'primeafter', area: 'numbers', minArgs: 1, maxArgs: 1, yieldsToCellNames: true,
    signature: 'primeafter(n) → integer', doc: 'The least prime greater than n.',
    example: { source: 'primeafter(100)', result: '101' },
    call: (a, c) => primeAfter(a, c, 'primeafter'),
  },
  {
    name: 'primebefore', area: 'numbers', minArgs: 1, maxArgs: 1, yieldsToCellNames: true,
    signature: 'primebefore(n) → integer', doc: 'The largest prime less than n (n > 2).',
    example: { source: 'primebefore(100)', result: '97' },
    call: (a, c) => primeBefore(a, c, 'primebefore'),
  },
  {
    name: 'primorial', area: 'numbers', minArgs: 1, maxArgs: 1,
    signature: 'primorial(n) → integer', doc: 'n#, the product of the primes ≤ n (also written n#).',
    example: { source: 'primorial(13)', result: '30030' },
    call: (a, c) => {
      const n = argInt(a, 0, c, 'primorial');
      if (n < 0n) throw domainError('primorial: n must be ≥ 0', c.span);
      A.checkBits(Number(n > 10n ** 9n ? 10n ** 9n : n) * 1.45, c.limits.maxBits, `${n}#`, c.span);
      let acc = 1n;
      forEachPrime(2n, n, c.span, (p) => { c.tick(); acc *= p; });
      return acc;
    },
  },
  {
    name: 'totient', area: 'numbers', minArgs: 1, maxArgs: 1,
    signature: 'totient(n) → integer', doc: "Euler's φ(n), from the prime factorisation (n ≤ 10^24).",
    example: { source: 'totient(30)', result: '8' },
    call: (a, c) => {
      const n = argInt(a, 0, c, 'totient');
      if (n < 1n) throw domainError('totient: n must be ≥ 1', c.span);
      let phi = n;
      for (const [p] of factorize(n, c, 'totient')) phi = (phi / p) * (p - 1n);
      return phi;
    },
  },
  {
    name: 'factor', area: 'numbers', minArgs: 1, maxArgs: 1,
    signature: 'factor(n) → table (prime, exponent)', doc: 'Prime factorisation of n ≥ 1 (trial division, then Pollard\'s rho; n ≤ 10^24).',
    example: { source: 'factor(360)', result: 'table (prime, exponent): (2, 3), (3, 2), (5, 1)' },
    call: (a, c) => {
      const n = argInt(a, 0, c, 'factor');
      if (n < 1n) throw domainError('factor: n must be ≥ 1', c.span);
      return new Table(['prime', 'exponent'], factorize(n, c, 'factor').map(([p, e]) => [p, BigInt(e)]));
    },
  },
  {
    name: 'gcd', area: 'numbers', minArgs: 1, maxArgs: 64,
    signature: 'gcd(a, b, …) → integer', doc: 'Greatest common divisor (of several integers or of a series).',
    example: { source: 'gcd(84, 36)', result: '12' },
    call: (a, c) => numbersOf(a, c, 'gcd').reduce<bigint>((g, x) => gcd(g, typeof x === 'bigint' ? x : badInt(x, c, 'gcd')), 0n),
  },
  {
    name: 'lcm', area: 'numbers', minArgs: 1, maxArgs: 64,
    signature: 'lcm(a, b, …) → integer', doc: 'Least common multiple (of several integers or of a series).',
    example: { source: 'lcm(4, 6, 10)', result: '60' },
    call: (a, c) => numbersOf(a, c, 'lcm').reduce<bigint>((l, x) => {
      const v = typeof x === 'bigint' ? (x < 0n ? -x : x) : badInt(x, c, 'lcm');
      if (v === 0n || l === 0n) return 0n;
      A.checkBits(bitLength(l) + bitLength(v), c.limits.maxBits, 'lcm', c.span);
      return (l / gcd(l, v)) * v;
    }, 1n),
  },
  {
    name: 'abs', area: 'numbers', minArgs: 1, maxArgs: 1,
    signature: 'abs(x) → number', doc: 'Absolute value.',
    example: { source: 'abs(-7/2)', result: '7/2' },
    call: (a, c) => {
      const x = argNum(a, 0, c, 'abs');
      return A.compareNum(x, 0n, 'abs', c.span) < 0 ? A.neg(x, c.span) : x;
    },
  },
  {
    name: 'floor', area: 'numbers', minArgs: 1, maxArgs: 1,
    signature: 'floor(x) → integer', doc: 'Largest integer ≤ x.',
    example: { source: 'floor(-7/2)', result: '-4' },
    call: (a, c) => roundWith(argNum(a, 0, c, 'floor'), 'floor', c),
  },
  {
    name: 'ceil', area: 'numbers', minArgs: 1, maxArgs: 1,
    signature: 'ceil(x) → integer', doc: 'Least integer ≥ x.',
    example: { source: 'ceil(7/2)', result: '4' },
    call: (a, c) => roundWith(argNum(a, 0, c, 'ceil'), 'ceil', c),
  },
  {
    name: 'round', area: 'numbers', minArgs: 1, maxArgs: 1,
    signature: 'round(x) → integer', doc: 'Nearest integer (halves away from zero).',
    example: { source: 'round(5/2)', result: '3' },
    call: (a, c) => roundWith(argNum(a, 0, c, 'round'), 'round', c),
  },
  {
    name: 'num', area: 'numbers', minArgs: 1, maxArgs: 1,
    signature: 'num(r) → integer', doc: 'Numerator of an exact number in lowest terms.',
    example: { source: 'num(6/4)', result: '3' },
    call: (a, c) => { const x = exact(argNum(a, 0, c, 'num'), c, 'num'); return typeof x === 'bigint' ? x : x.n; },
  },
  {
    name: 'den', area: 'numbers', minArgs: 1, maxArgs: 1,
    signature: 'den(r) → integer', doc: 'Denominator of an exact number in lowest terms.',
    example: { source: 'den(6/4)', result: '2' },
    call: (a, c) => { const x = exact(argNum(a, 0, c, 'den'), c, 'den'); return typeof x === 'bigint' ? 1n : x.d; },
  },
  {
    name: 'real', area: 'numbers', minArgs: 1, maxArgs: 1,
    signature: 'real(x) → real', doc: 'The nearest double to x (leaves exact arithmetic on purpose).',
    example: { source: 'real(1/3)', result: '0.3333333333333333' },
    call: (a, c) => A.toReal(argNum(a, 0, c, 'real')),
  },
  {
    name: 'sqrt', area: 'numbers', minArgs: 1, maxArgs: 1,
    signature: 'sqrt(x) → real', doc: 'Square root as a real; isqrt gives the exact integer part.',
    example: { source: 'sqrt(2)', result: '1.4142135623730951' },
    call: (a, c) => { const x = A.toReal(argNum(a, 0, c, 'sqrt')); if (x < 0) throw domainError('sqrt: negative argument', c.span); return Math.sqrt(x); },
  },
  {
    name: 'isqrt', area: 'numbers', minArgs: 1, maxArgs: 1,
    signature: 'isqrt(n) → integer', doc: '⌊√n⌋ exactly, for an integer n ≥ 0.',
    example: { source: 'isqrt(10^20 + 1)', result: '10000000000' },
    call: (a, c) => { const n = argInt(a, 0, c, 'isqrt'); if (n < 0n) throw domainError('isqrt: negative argument', c.span); return intSqrt(n); },
  },
  {
    name: 'ln', area: 'numbers', minArgs: 1, maxArgs: 1,
    signature: 'ln(x) → real', doc: 'Natural logarithm (also of integers beyond 2^1024).',
    example: { source: 'ln(10^100)', result: '230.25850929940458' },
    call: (a, c) => {
      const x = argNum(a, 0, c, 'ln');
      if (A.compareNum(x, 0n, 'ln', c.span) <= 0) throw domainError('ln: the argument must be positive', c.span);
      if (typeof x === 'bigint' && bitLength(x) > 1000) {
        const shift = bitLength(x) - 60;
        return Math.log(Number(x >> BigInt(shift))) + shift * Math.LN2;
      }
      return Math.log(A.toReal(x));
    },
  },
  {
    name: 'exp', area: 'numbers', minArgs: 1, maxArgs: 1,
    signature: 'exp(x) → real', doc: 'e^x as a real.',
    example: { source: 'exp(1)', result: '2.718281828459045' },
    call: (a, c) => Math.exp(A.toReal(argNum(a, 0, c, 'exp'))),
  },
  // ---------------------------------------------------------------- collections
  {
    name: 'size', area: 'collections', minArgs: 1, maxArgs: 1,
    signature: 'size(x) → integer', doc: 'Number of elements of a tuple, series, range (integers in it), record or table (rows).',
    example: { source: 'size({0, 2, 6, 8})', result: '4' },
    call: (a, c) => {
      const v = a[0]!;
      if (v instanceof Tuple) return BigInt(v.size);
      if (Array.isArray(v)) return BigInt(v.length);
      if (v instanceof IntRange && !v.primesOnly) return v.span;
      if (v instanceof IntRange) { let n = 0n; forEachPrime(v.lo, v.hi, c.span, () => { c.tick(); n++; }); return n; }
      if (v instanceof SiftRecord) return BigInt(v.fields.size);
      if (v instanceof Table) return BigInt(v.rows.length);
      if (typeof v === 'string') return BigInt([...v].length);
      throw typeError(`size: a ${typeName(v)} has no size`, c.span);
    },
  },
  {
    name: 'sum', area: 'collections', minArgs: 1, maxArgs: 1,
    signature: 'sum(s) → number', doc: 'Sum of a series (∑[x ∈ …] e is the bound form).',
    example: { source: 'sum([1, 2, 3])', result: '6' },
    call: (a, c) => toSeries(a[0]!, c, 'sum').reduce<Value>((acc, x) => { c.tick(); return A.add(acc, x, c.span); }, 0n),
  },
  {
    name: 'prod', area: 'collections', minArgs: 1, maxArgs: 1,
    signature: 'prod(s) → number', doc: 'Product of a series (∏[x ∈ …] e is the bound form).',
    example: { source: 'prod(primes 2..13)', result: '30030' },
    call: (a, c) => toSeries(a[0]!, c, 'prod').reduce<Value>((acc, x) => { c.tick(); return A.mul(acc, x, c.span, c.limits.maxBits); }, 1n),
  },
  {
    name: 'all', area: 'collections', minArgs: 1, maxArgs: 1,
    signature: 'all(s) → boolean', doc: 'Whether every element of a series of booleans is true (∀[x ∈ …] c is the bound form).',
    example: { source: 'all([true, 1 < 2])', result: 'true' },
    call: (a, c) => toSeries(a[0]!, c, 'all').every((x) => bool(x, c, 'all')),
  },
  {
    name: 'any', area: 'collections', minArgs: 1, maxArgs: 1,
    signature: 'any(s) → boolean', doc: 'Whether some element of a series of booleans is true (∃[x ∈ …] c is the bound form).',
    example: { source: 'any([false, 2 > 1])', result: 'true' },
    call: (a, c) => toSeries(a[0]!, c, 'any').some((x) => bool(x, c, 'any')),
  },
  {
    name: 'min', area: 'collections', minArgs: 1, maxArgs: 64,
    signature: 'min(s) or min(a, b, …) → number', doc: 'Least element.',
    example: { source: 'min([5, 3, 9])', result: '3' },
    call: (a, c) => extreme(numbersOf(a, c, 'min'), c, -1),
  },
  {
    name: 'max', area: 'collections', minArgs: 1, maxArgs: 64,
    signature: 'max(s) or max(a, b, …) → number', doc: 'Greatest element.',
    example: { source: 'max([5, 3, 9])', result: '9' },
    call: (a, c) => extreme(numbersOf(a, c, 'max'), c, 1),
  },
  {
    name: 'sort', area: 'collections', minArgs: 1, maxArgs: 1,
    signature: 'sort(s) → series', doc: 'The numbers of a series in increasing order.',
    example: { source: 'sort([3, 1, 2])', result: '[1, 2, 3]' },
    call: (a, c) => { const s = [...argSeries(a, 0, c, 'sort')]; c.tick(s.length); return s.sort((x, y) => cmp(x, y, c)); },
  },
  {
    name: 'reverse', area: 'collections', minArgs: 1, maxArgs: 1,
    signature: 'reverse(s) → series', doc: 'A series in reverse order.',
    example: { source: 'reverse([1, 2, 3])', result: '[3, 2, 1]' },
    call: (a, c) => [...argSeries(a, 0, c, 'reverse')].reverse(),
  },
  {
    name: 'first', area: 'collections', minArgs: 1, maxArgs: 1,
    signature: 'first(s) → value', doc: 'First element of a series or tuple.',
    example: { source: 'first([4, 5])', result: '4' },
    call: (a, c) => { const s = argSeries(a, 0, c, 'first'); if (!s.length) throw domainError('first: empty series', c.span); return s[0]!; },
  },
  {
    name: 'last', area: 'collections', minArgs: 1, maxArgs: 1,
    signature: 'last(s) → value', doc: 'Last element of a series or tuple.',
    example: { source: 'last([4, 5])', result: '5' },
    call: (a, c) => { const s = argSeries(a, 0, c, 'last'); if (!s.length) throw domainError('last: empty series', c.span); return s[s.length - 1]!; },
  },
  {
    name: 'diffs', area: 'collections', minArgs: 1, maxArgs: 1,
    signature: 'diffs(s) → series', doc: 'Consecutive differences s[i+1] − s[i] (the gaps of a tuple).',
    example: { source: 'diffs({0, 2, 6, 8})', result: '[2, 4, 2]' },
    call: (a, c) => { const s = argSeries(a, 0, c, 'diffs'); c.tick(s.length); return s.slice(1).map((x, i) => A.add(x, s[i]!, c.span, -1n)); },
  },
  {
    name: 'series', area: 'collections', minArgs: 1, maxArgs: 1,
    signature: 'series(x) → series', doc: 'The elements of a range, prime range, tuple or table (rows) as a series.',
    example: { source: 'series(primes 10..30)', result: '[11, 13, 17, 19, 23, 29]' },
    call: (a, c) => toSeries(a[0]!, c, 'series'),
  },
  {
    name: 'tuple', area: 'collections', minArgs: 1, maxArgs: 1,
    signature: 'tuple(s) → tuple', doc: 'The distinct integers of a series as a tuple, increasing.',
    example: { source: 'tuple([8, 0, 2, 6])', result: '{0, 2, 6, 8}' },
    call: (a, c) => {
      const s = toSeries(a[0]!, c, 'tuple');
      const ints = s.map((x) => (typeof x === 'bigint' ? x : badInt(x, c, 'tuple')));
      return new Tuple([...new Set(ints)].sort((x, y) => (x < y ? -1 : x > y ? 1 : 0)));
    },
  },
  {
    name: 'shift', area: 'tuples', minArgs: 2, maxArgs: 2,
    signature: 'shift(H, n) → tuple', doc: 'The tuple H + n = {h + n : h ∈ H}.',
    example: { source: 'shift({0, 2, 6}, 5)', result: '{5, 7, 11}' },
    call: (a, c) => { const h = argTuple(a, 0, c, 'shift'); const n = argInt(a, 1, c, 'shift'); return new Tuple(h.map((x) => x + n)); },
  },
  {
    name: 'column', area: 'collections', minArgs: 2, maxArgs: 2,
    signature: 'column(T, name) → series', doc: 'One column of a table (T.name when the name is a plain word).',
    example: { source: 'column(factor(360), "prime")', result: '[2, 3, 5]' },
    call: (a, c) => {
      const t = argTable(a, 0, c, 'column');
      const name = argString(a, 1, c, 'column');
      const col = t.column(name);
      if (!col) throw typeError(`column: no column '${name}' (columns: ${t.columns.join(', ')})`, c.span);
      return col;
    },
  },
  {
    name: 'columns', area: 'collections', minArgs: 1, maxArgs: 1,
    signature: 'columns(T) → series of strings', doc: 'Column names of a table (or field names of a record).',
    example: { source: 'columns(factor(12))', result: '["prime", "exponent"]' },
    call: (a, c) => {
      const v = a[0]!;
      if (v instanceof Table) return [...v.columns];
      return [...argRecord(a, 0, c, 'columns').fields.keys()];
    },
  },
  {
    name: 'table', area: 'collections', minArgs: 1, maxArgs: 1,
    signature: 'table(rows) → table', doc: 'A table from a series of records with the same fields (table[…](…) is the bound form).',
    example: { source: 'table([(p: 2, q: 3), (p: 5, q: 7)])', result: 'table (p, q): (2, 3), (5, 7)' },
    call: (a, c) => {
      const rows = argSeries(a, 0, c, 'table');
      if (rows.length === 0) return new Table([], []);
      const first = rows[0];
      if (!(first instanceof SiftRecord)) throw typeError(`table: rows must be records, got ${typeName(first!)}`, c.span);
      const cols = [...first.fields.keys()];
      return new Table(cols, rows.map((r) => {
        if (!(r instanceof SiftRecord) || r.fields.size !== cols.length || cols.some((k) => !r.fields.has(k))) {
          throw typeError(`table: every row must have the fields ${cols.join(', ')}`, c.span);
        }
        return cols.map((k) => r.fields.get(k)!);
      }));
    },
  },
  {
    name: 'text', area: 'collections', minArgs: 1, maxArgs: 1,
    signature: 'text(x) → string', doc: 'The exact text of a value (for labels and notes).',
    example: { source: 'text(7#)', result: '210' },
    call: (a) => formatValue(a[0]!),
  },
];

function primeTest(a: Value[], c: CallContext, fn: string): boolean {
  return isPrime(argInt(a, 0, c, fn));
}

function primeAfter(a: Value[], c: CallContext, fn: string): bigint {
  let n = argInt(a, 0, c, fn);
  A.checkBits(bitLength(n), 4096, `${fn} argument`, c.span);
  if (n < 2n) return 2n;
  do { n++; c.tick(); } while (!isPrime(n));
  return n;
}

function primeBefore(a: Value[], c: CallContext, fn: string): bigint {
  let n = argInt(a, 0, c, fn);
  if (n <= 2n) throw domainError(`${fn}: there is no prime below ${n}`, c.span);
  A.checkBits(bitLength(n), 4096, `${fn} argument`, c.span);
  do { n--; c.tick(); } while (!isPrime(n));
  return n;
}

function badInt(x: Value, c: CallContext, fn: string): never {
  throw typeError(`${fn}: expected integers, got ${typeName(x)}`, c.span);
}

function bool(x: Value, c: CallContext, fn: string): boolean {
  if (typeof x !== 'boolean') throw typeError(`${fn}: expected true/false elements, got ${typeName(x)}`, c.span);
  return x;
}

function exact(x: bigint | Rational | number, c: CallContext, fn: string): bigint | Rational {
  if (typeof x === 'number') throw typeError(`${fn}: a real has no exact numerator or denominator`, c.span);
  return x;
}

function extreme(s: Value[], c: CallContext, sign: 1 | -1): Value {
  if (s.length === 0) throw domainError('the series is empty', c.span);
  c.tick(s.length);
  return s.reduce((m, x) => (cmp(x, m, c) * sign > 0 ? x : m));
}

function roundWith(x: bigint | Rational | number, mode: 'floor' | 'ceil' | 'round', c: CallContext): bigint {
  if (typeof x === 'bigint') return x;
  if (typeof x === 'number') {
    if (!Number.isFinite(x)) throw domainError(`${mode}: not a finite number`, c.span);
    const r = mode === 'floor' ? Math.floor(x) : mode === 'ceil' ? Math.ceil(x) : Math.sign(x) * Math.round(Math.abs(x));
    return BigInt(r);
  }
  const fl = x.n >= 0n ? x.n / x.d : -((-x.n + x.d - 1n) / x.d);
  if (mode === 'floor') return fl;
  if (mode === 'ceil') return fl + 1n;
  const twice = Rational.of(2n * x.n, x.d);
  const frac2 = typeof twice === 'bigint' ? twice - 2n * fl : null; // exactly a half when twice is an integer
  if (frac2 === 1n) return x.n > 0n ? fl + 1n : fl;
  return A.compareNum(A.add(x, fl, c.span, -1n), Rational.of(1n, 2n), 'round', c.span) > 0 ? fl + 1n : fl;
}

defineBuiltins(core);

// Old spellings (hidden): their messages keep the old name, so old cells give the same outputs.
const named = (n: string) => core.find((b) => b.name === n)!;
defineBuiltins([
  oldSpelling(named('prime'), 'isprime', (a, c) => primeTest(a, c, 'isprime')),
  oldSpelling(named('primeafter'), 'nextprime', (a, c) => primeAfter(a, c, 'nextprime')),
  oldSpelling(named('primebefore'), 'prevprime', (a, c) => primeBefore(a, c, 'prevprime')),
]);

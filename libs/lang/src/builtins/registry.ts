import type { WorkHooks } from '@cribra/engine';
import { domainError, type SourceSpan, typeError } from '../errors';
import type { DataAccess } from '../provider/types';
import type { Limits } from '../runtime/limits';
import { Rational } from '../values/rational';
import { IntRange, SiftRecord, Table, Tuple, typeName, type Value } from '../values/types';

/** What a builtin may use besides its arguments. */
export interface CallContext {
  span: SourceSpan;
  argSpans: SourceSpan[];
  limits: Limits;
  /** Stored data, or null when the run has none. */
  data: DataAccess | null;
  /** Counts `n` steps and checks the time limit and cancellation; call it inside long loops. */
  tick(n?: number): void;
  /** Reports progress of a long builtin (fraction 0..1). */
  progress(fraction: number, message: string): void;
  /**
   * Hooks for a long engine call: its progress is reported under `message`, and its stop check
   * throws the run's time-limit or cancellation error from inside the engine's loop.
   */
  work(message: string): WorkHooks;
}


export type BuiltinArea = 'numbers' | 'collections' | 'tuples' | 'wheel' | 'counts' | 'fit' | 'primes' | 'hardy-littlewood' | 'narrow' | 'data';

export interface Builtin {
  name: string;
  /** e.g. `gapcount(g, p) → integer`. */
  signature: string;
  /** One line for completion lists and hover. */
  doc: string;
  /** A worked example (Sift source) and what it gives. */
  example: { source: string; result: string };
  area: BuiltinArea;
  minArgs: number;
  maxArgs: number;
  /**
   * An old spelling kept so that existing and locked cells still run with the same outputs and
   * digest: callable, but left out of allBuiltins() (completions, docs). Names the builtin to use instead.
   */
  aliasOf?: string;
  /**
   * A name added after cells could already use it for their own values: a cell's let, parameter or
   * binder of this name hides the builtin instead of being refused, so that no existing cell breaks.
   */
  yieldsToCellNames?: boolean;
  call(args: Value[], ctx: CallContext): Value;
}

const registry = new Map<string, Builtin>();

export function defineBuiltins(list: Builtin[]): void {
  for (const b of list) registry.set(b.name, b);
}

/** The same builtin under its old spelling (hidden; `call` receives the spelling for its messages). */
export function oldSpelling(b: Builtin, name: string, call: Builtin['call']): Builtin {
  return { ...b, name, signature: b.signature.replace(b.name, name), aliasOf: b.name, yieldsToCellNames: false, call };
}

export function builtin(name: string): Builtin | undefined {
  return registry.get(name);
}

/** The builtins to offer and document, sorted by name (hidden old spellings left out). */
export function allBuiltins(): Builtin[] {
  return [...registry.values()].filter((b) => !b.aliasOf).sort((a, b) => a.name.localeCompare(b.name));
}

/** The hidden old spellings (each names its new builtin in `aliasOf`). */
export function oldSpellings(): Builtin[] {
  return [...registry.values()].filter((b) => b.aliasOf);
}

// ---- argument helpers: each names the argument and the function in its message

export function argInt(args: Value[], i: number, ctx: CallContext, fn: string): bigint {
  const v = args[i]!;
  if (typeof v !== 'bigint') throw typeError(`${fn}: argument ${i + 1} must be an integer, got ${typeName(v)}`, ctx.argSpans[i] ?? ctx.span);
  return v;
}

/** An integer argument that must fit a double exactly and lie in [min, max]. */
export function argSmall(args: Value[], i: number, ctx: CallContext, fn: string, min: number, max: number): number {
  const v = argInt(args, i, ctx, fn);
  if (v < BigInt(min) || v > BigInt(max)) throw domainError(`${fn}: argument ${i + 1} must lie in ${min}..${max}, got ${v}`, ctx.argSpans[i] ?? ctx.span);
  return Number(v);
}

export function argNum(args: Value[], i: number, ctx: CallContext, fn: string): bigint | Rational | number {
  const v = args[i]!;
  if (typeof v === 'bigint' || typeof v === 'number' || v instanceof Rational) return v;
  throw typeError(`${fn}: argument ${i + 1} must be a number, got ${typeName(v)}`, ctx.argSpans[i] ?? ctx.span);
}

export function argString(args: Value[], i: number, ctx: CallContext, fn: string): string {
  const v = args[i]!;
  if (typeof v !== 'string') throw typeError(`${fn}: argument ${i + 1} must be a string, got ${typeName(v)}`, ctx.argSpans[i] ?? ctx.span);
  return v;
}

export function argBool(args: Value[], i: number, ctx: CallContext, fn: string): boolean {
  const v = args[i]!;
  if (typeof v !== 'boolean') throw typeError(`${fn}: argument ${i + 1} must be true or false, got ${typeName(v)}`, ctx.argSpans[i] ?? ctx.span);
  return v;
}

/** A tuple argument; a series of integers is accepted too. */
export function argTuple(args: Value[], i: number, ctx: CallContext, fn: string): bigint[] {
  const v = args[i]!;
  if (v instanceof Tuple) return v.offsets;
  if (Array.isArray(v) && v.every((x) => typeof x === 'bigint')) return v as bigint[];
  throw typeError(`${fn}: argument ${i + 1} must be a tuple such as {0, 2, 6}, got ${typeName(v)}`, ctx.argSpans[i] ?? ctx.span);
}

export function argSeries(args: Value[], i: number, ctx: CallContext, fn: string): Value[] {
  const v = args[i]!;
  if (Array.isArray(v)) return v;
  if (v instanceof Tuple) return v.offsets;
  throw typeError(`${fn}: argument ${i + 1} must be a series such as [1, 2, 3], got ${typeName(v)}`, ctx.argSpans[i] ?? ctx.span);
}

export function argRange(args: Value[], i: number, ctx: CallContext, fn: string): IntRange {
  const v = args[i]!;
  if (v instanceof IntRange) return v;
  throw typeError(`${fn}: argument ${i + 1} must be a range such as 1..10^6, got ${typeName(v)}`, ctx.argSpans[i] ?? ctx.span);
}

export function argTable(args: Value[], i: number, ctx: CallContext, fn: string): Table {
  const v = args[i]!;
  if (v instanceof Table) return v;
  throw typeError(`${fn}: argument ${i + 1} must be a table, got ${typeName(v)}`, ctx.argSpans[i] ?? ctx.span);
}

export function argRecord(args: Value[], i: number, ctx: CallContext, fn: string): SiftRecord {
  const v = args[i]!;
  if (v instanceof SiftRecord) return v;
  throw typeError(`${fn}: argument ${i + 1} must be a record, got ${typeName(v)}`, ctx.argSpans[i] ?? ctx.span);
}

/** A bigint from a number the engine returned (exact below 2^53, or already a bigint). */
export function big(x: number | bigint): bigint {
  return typeof x === 'bigint' ? x : BigInt(x);
}

/** An integer for progress messages: 3000000000 → "3·10^9", 10^9 → "10^9", others in decimal. */
export function compactInt(n: bigint): string {
  if (n < 1000n) return n.toString();
  let m = n;
  let k = 0;
  while (m % 10n === 0n) {
    m /= 10n;
    k++;
  }
  if (k < 3) return n.toString();
  return m === 1n ? `10^${k}` : `${m}·10^${k}`;
}

export const rec = (entries: [string, Value][]): SiftRecord => SiftRecord.of(entries);

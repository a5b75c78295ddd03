import type { Expr } from '../syntax/ast';
import { Rational } from './rational';

/** An admissible-tuple candidate: distinct integers in increasing order (not shifted). */
export class Tuple {
  constructor(readonly offsets: bigint[]) {}
  get size(): number {
    return this.offsets.length;
  }
}

/** The integers lo..hi (both included), or only the primes among them. */
export class IntRange {
  constructor(
    readonly lo: bigint,
    readonly hi: bigint,
    readonly primesOnly: boolean,
  ) {}
  /** Number of integers in the range (an upper bound of the number of primes in it). */
  get span(): bigint {
    return this.hi >= this.lo ? this.hi - this.lo + 1n : 0n;
  }
}

/** Named fields in a fixed order. */
export class SiftRecord {
  constructor(readonly fields: Map<string, Value>) {}
  static of(entries: [string, Value][]): SiftRecord {
    return new SiftRecord(new Map(entries));
  }
  get(name: string): Value | undefined {
    return this.fields.get(name);
  }
}

/** Named columns of equal length. Rows are stored row-major. */
export class Table {
  constructor(
    readonly columns: string[],
    readonly rows: Value[][],
  ) {}
  column(name: string): Value[] | null {
    const i = this.columns.indexOf(name);
    return i < 0 ? null : this.rows.map((r) => r[i]!);
  }
}

/** A user function defined with `let f(x, y) = …`; it sees only the names defined before it. */
export class UserFn {
  constructor(
    readonly name: string,
    readonly params: string[],
    readonly body: Expr,
    readonly scope: unknown,
  ) {}
}

/**
 * Sift values: bigint (exact integer), Rational, number (real, only for inherently approximate
 * quantities), boolean, string, Tuple, IntRange, Value[] (series), SiftRecord, Table, UserFn.
 */
export type Value = bigint | Rational | number | boolean | string | Tuple | IntRange | Value[] | SiftRecord | Table | UserFn;

export function typeName(v: Value): string {
  switch (typeof v) {
    case 'bigint':
      return 'integer';
    case 'number':
      return 'real';
    case 'boolean':
      return 'boolean';
    case 'string':
      return 'string';
  }
  if (v instanceof Rational) return 'rational';
  if (v instanceof Tuple) return 'tuple';
  if (v instanceof IntRange) return v.primesOnly ? 'prime range' : 'range';
  if (Array.isArray(v)) return 'series';
  if (v instanceof SiftRecord) return 'record';
  if (v instanceof Table) return 'table';
  return 'function';
}

// Typed outputs of a Sift run, as plain JSON (shared by the runner, the API and the web app).
// Exact numbers travel as decimal strings; reals as JSON numbers.

/** A value as JSON. Integers and rationals are exact decimal strings ("-12", "3/4"). */
export type ValueJson =
  | { t: 'int'; v: string }
  | { t: 'rat'; v: string }
  | { t: 'real'; v: number | 'NaN' | 'Infinity' | '-Infinity' }
  | { t: 'bool'; v: boolean }
  | { t: 'str'; v: string }
  | { t: 'tuple'; v: string[] }
  | { t: 'range'; lo: string; hi: string; primes: boolean }
  | { t: 'series'; v: ValueJson[] }
  | { t: 'record'; v: Array<[string, ValueJson]> }
  | { t: 'table'; columns: string[]; rows: ValueJson[][] }
  | { t: 'fn'; v: string };

/** `show e` (or a bare expression): one value with its exact rendering. */
export interface ValueOutput {
  kind: 'value';
  label: string | null;
  value: ValueJson;
  /** Exact text (all digits of integers; reals with `digits` significant digits when asked). */
  text: string;
}

/** A table of named columns. */
export interface TableOutput {
  kind: 'table';
  label: string | null;
  columns: string[];
  rows: ValueJson[][];
}

export type ChartKind = 'line' | 'scatter' | 'bar';

/** A chart specification; the web app draws it. Points are doubles (exact values belong in tables). */
export interface ChartOutput {
  kind: 'chart';
  chart: ChartKind;
  title: string | null;
  x: { label: string; log: boolean };
  y: { label: string; log: boolean };
  series: Array<{ name: string; points: Array<[number | string, number | null]> }>;
}

/** One assignment of a claim's bound names. */
export type Binding = Array<[string, ValueJson]>;

/** The verdict of a `claim`: holds on everything checked, or fails with the first counterexample. */
export interface VerdictOutput {
  kind: 'verdict';
  label: string | null;
  /** The claim as written. */
  statement: string;
  holds: boolean;
  /** The quantifier as written (`p ∈ primes 5..29`), or null for a claim without `over`. */
  over: string | null;
  /** Number of cases evaluated (the failing one included). */
  checked: number;
  /** Cases the conditions in `over` left out. */
  skipped: number;
  first: Binding | null;
  last: Binding | null;
  /** Present when the claim fails. */
  counterexample: {
    binding: Binding;
    /** The relation that failed (`=`, `<`, …), or null when the claim is a plain condition. */
    relation: string | null;
    lhs: ValueJson;
    rhs: ValueJson | null;
  } | null;
  /** One sentence: what holds over what, or where it fails. */
  summary: string;
}

export interface TextOutput {
  kind: 'text';
  text: string;
}

export type SiftOutput = ValueOutput | TableOutput | ChartOutput | VerdictOutput | TextOutput;
export type SiftOutputKind = SiftOutput['kind'];

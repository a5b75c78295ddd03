import { evaluate, type RunOptions, type RunResult, type SiftOutput } from '../src';

/** Runs a cell and fails the test on any error. */
export function run(source: string, options?: RunOptions): RunResult {
  const r = evaluate(source, options);
  if (r.error) throw new Error(`unexpected ${r.error.kind} error: ${r.error.message} (${JSON.stringify(r.error)})`);
  return r;
}

/** Text of the single value output of a one-expression cell. */
export function value(source: string, options?: RunOptions): string {
  const outs = run(source, options).outputs;
  const o = outs[outs.length - 1] as SiftOutput;
  if (o.kind === 'value') return o.text;
  if (o.kind === 'text') return o.text;
  throw new Error(`expected a value output, got ${o.kind}`);
}

/** The error of a cell that must fail. */
export function failure(source: string, options?: RunOptions) {
  const r = evaluate(source, options);
  if (!r.error) throw new Error(`expected an error, got outputs ${JSON.stringify(r.outputs)}`);
  return r.error;
}

import { ENGINE_VERSION } from '@cribra/engine';
import './builtins';
import { SiftError, type SiftErrorJson } from './errors';
import { outputsDigest } from './outputs/digest';
import type { SiftOutput } from './outputs/types';
import type { DataAccess } from './provider/types';
import { asSiftError, Interpreter } from './runtime/interpreter';
import { type Limits, resolveLimits } from './runtime/limits';
import { parse } from './syntax/parse';
import { LANG_VERSION } from './version';

export interface RunOptions {
  /** Overrides of DEFAULT_LIMITS. */
  limits?: Partial<Limits>;
  /** Stored data the cell may read (levels, ledger, uploads); none by default. */
  data?: DataAccess | null;
  onProgress?: (fraction: number, message: string) => void;
  /** Polled regularly; return true to stop the run (error kind 'cancelled'). */
  shouldStop?: () => boolean;
}

/** A run's error: a SiftError as JSON, or 'internal' for a defect of Cribra itself. */
export type RunErrorJson = SiftErrorJson | { kind: 'internal'; message: string };

export interface RunResult {
  ok: boolean;
  /** Outputs in statement order (those produced before an error are kept). */
  outputs: SiftOutput[];
  /** Canonical SHA-256 of the outputs (see outputsDigest). */
  digest: string;
  /** The error that stopped the run, or null. */
  error: RunErrorJson | null;
  /** Every syntax error of the cell (empty when it parsed). */
  diagnostics: SiftErrorJson[];
  steps: number;
  millis: number;
  languageVersion: string;
  engineVersion: string;
}

/**
 * Parses and runs one Sift cell in the calling thread, within the limits. Never throws for
 * anything a cell can contain; failures come back in `error`. Deterministic: the same source and
 * data give the same outputs and digest.
 */
export function evaluate(source: string, options: RunOptions = {}): RunResult {
  const started = Date.now();
  const limits = resolveLimits(options.limits);
  const base = { languageVersion: LANG_VERSION, engineVersion: ENGINE_VERSION };
  const parsed = parse(source);
  if (parsed.errors.length > 0) {
    const diagnostics = parsed.errors.map((e) => e.toJSON());
    return { ok: false, outputs: [], digest: outputsDigest([]), error: firstOfAll(diagnostics), diagnostics, steps: 0, millis: Date.now() - started, ...base };
  }
  const interp = new Interpreter({ limits, data: options.data ?? null, onProgress: options.onProgress, shouldStop: options.shouldStop });
  let error: RunErrorJson | null = null;
  try {
    interp.run(parsed.program);
  } catch (e) {
    error = toRunError(e);
  }
  const outputs = interp.outputs;
  return { ok: error === null, outputs, digest: outputsDigest(outputs), error, diagnostics: [], steps: interp.steps, millis: Date.now() - started, ...base };
}

/** The first syntax error, its message naming the lines of the others (all of them are in `diagnostics`). */
function firstOfAll(diagnostics: SiftErrorJson[]): SiftErrorJson {
  const [first, ...rest] = diagnostics;
  if (!rest.length) return first!;
  const lines = [...new Set(rest.map((d) => d.line ?? 1))];
  const where = lines.length === 1 ? `on line ${lines[0]}` : `on lines ${lines.slice(0, -1).join(', ')} and ${lines.at(-1)}`;
  return { ...first!, message: `${first!.message} (and ${rest.length} more syntax error${rest.length === 1 ? '' : 's'}, ${where})` };
}

function toRunError(e: unknown): RunErrorJson {
  const converted = asSiftError(e, { offset: 0, line: 1, column: 1, length: 0 });
  if (converted instanceof SiftError) return converted.toJSON();
  if (e instanceof RangeError) return { kind: 'limit', message: `the run nests too deeply (${e.message})` };
  const message = e instanceof Error ? e.message : String(e);
  return { kind: 'internal', message: `internal error: ${message}` };
}

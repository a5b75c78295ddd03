// The arguments `cribra run` and `cribra verify` share: one positional input, --json, --workers N
// and --timeout SECONDS; each command may take further options of its own.
import { availableParallelism } from 'node:os';

export interface CellRunArgs {
  /** The positional argument (a file, or a record's file or URL). */
  input: string;
  json: boolean;
  workers: number;
  timeoutS: number | null;
}

export interface CellRunArgsOptions {
  /** Message when the positional argument is missing. */
  missing: string;
  /** Reads a positive count (--workers, --timeout); throws with its own wording. */
  positive: (value: string, flag: string) => number;
  /** A command's own option: returns true when it took `flag` (calling `value()` for its value). */
  extra?: (flag: string, value: () => string) => boolean;
}

/** @throws Error with a one-line message for a missing value, an unknown option or a second input. */
export function parseCellRunArgs(argv: readonly string[], options: CellRunArgsOptions): CellRunArgs {
  const args: CellRunArgs = { input: '', json: false, workers: availableParallelism(), timeoutS: null };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    const value = () => {
      const v = argv[++i];
      if (v === undefined) throw new Error(`${a} needs a value`);
      return v;
    };
    if (a === '--json') args.json = true;
    else if (a === '--workers') args.workers = options.positive(value(), '--workers');
    else if (a === '--timeout') args.timeoutS = options.positive(value(), '--timeout');
    else if (options.extra?.(a, value)) continue;
    else if (a.startsWith('--')) throw new Error(`unknown option ${a}`);
    else if (!args.input) args.input = a;
    else throw new Error(`unexpected argument ${a}`);
  }
  if (!args.input) throw new Error(options.missing);
  return args;
}

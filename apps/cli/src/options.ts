import { parseArgs } from 'node:util';
import { availableParallelism } from 'node:os';
import { CliError } from './cli-error';
import { parseSmallInteger } from './numbers';

/** Flag specification: string flags take a value, boolean flags do not. */
export type FlagSpec = Record<string, { type: 'string' | 'boolean'; short?: string }>;

/** Flags every subcommand accepts. */
export const COMMON_FLAGS: FlagSpec = { json: { type: 'boolean' }, help: { type: 'boolean', short: 'h' } };

/** Flag of subcommands whose work runs on worker threads. */
export const WORKERS_FLAG: FlagSpec = { workers: { type: 'string' } };

export type ParsedFlags = Record<string, string | boolean | undefined>;

/**
 * Parses flags with node's util.parseArgs (strict: unknown flags and stray arguments are errors).
 * A value that starts with a minus sign may follow its flag (`--from -5` reads as `--from=-5`).
 * @throws CliError with node's message reduced to one line.
 */
export function parseFlags(argv: readonly string[], spec: FlagSpec): ParsedFlags {
  const options = { ...COMMON_FLAGS, ...spec };
  const args: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    const name = a.startsWith('--') ? a.slice(2) : '';
    const next = argv[i + 1];
    if (options[name]?.type === 'string' && next !== undefined && /^-\d/.test(next)) {
      args.push(`${a}=${next}`);
      i++;
    } else args.push(a);
  }
  try {
    const { values } = parseArgs({ args, options, strict: true, allowPositionals: false });
    return values as ParsedFlags;
  } catch (e) {
    const code = (e as { code?: string }).code;
    // node's messages run over several sentences and lines; keep the first sentence.
    const first = ((e as Error).message.split('\n')[0] ?? '').split('. ')[0]!.replace(/\.$/, '');
    if (code === 'ERR_PARSE_ARGS_UNKNOWN_OPTION') throw new CliError(first.replace(/^Unknown option/, 'unknown flag'));
    if (code === 'ERR_PARSE_ARGS_UNEXPECTED_POSITIONAL') throw new CliError(first.replace(/^Unexpected argument/, 'unexpected argument'));
    throw new CliError(first);
  }
}

/** The value of a string flag, or a CliError when it is missing. */
export function requireFlag(flags: ParsedFlags, name: string): string {
  const v = flags[name];
  if (typeof v !== 'string') throw new CliError(`missing --${name}`);
  return v;
}

/** --workers N (1 … 256), default: all cores. */
export function workersFlag(flags: ParsedFlags): number {
  const v = flags.workers;
  if (typeof v !== 'string') return availableParallelism();
  return parseSmallInteger(v, '--workers', 1, 256);
}

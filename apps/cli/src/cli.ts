import { EngineError } from '@cribra/engine';
import { CliError } from './cli-error';
import type { CommandIo } from './command';
import { COMMANDS } from './commands/registry';

/** Exit code of usage and input errors (bad flag, bad number, limits, domain errors). */
export const EXIT_USAGE = 2;
/** Exit code of an unexpected internal failure (a bug): still one line, no stack trace. */
export const EXIT_INTERNAL = 3;

function overview(): string {
  const width = Math.max(...COMMANDS.map((c) => c.name.length));
  return [
    'usage: cribra <command> [flags]   (cribra <command> --help for its flags)',
    '',
    ...COMMANDS.map((c) => `  ${c.name.padEnd(width)}  ${c.summary}`),
    '',
    'Common flags: --json (machine-readable output; big numbers as decimal strings), --help.',
    'Integers may be written 1000, 1_000, 1e9 or 10^12.',
    '',
  ].join('\n');
}

/** Runs `cribra` with the given arguments; returns the exit code. Never throws. */
export async function main(argv: readonly string[], io: CommandIo): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined) {
    io.err(overview());
    return EXIT_USAGE;
  }
  if (name === '--help' || name === '-h' || name === 'help') {
    io.out(overview());
    return 0;
  }
  const command = COMMANDS.find((c) => c.name === name);
  if (!command) {
    io.err(`cribra: unknown command "${name}" (commands: ${COMMANDS.map((c) => c.name).join(', ')})\n`);
    return EXIT_USAGE;
  }
  if (rest.includes('--help') || rest.includes('-h')) {
    io.out(`usage: ${command.usage}\n${command.summary}\n`);
    return 0;
  }
  try {
    return await command.run(rest, io);
  } catch (e) {
    if (e instanceof CliError || e instanceof EngineError || isEngineErrorLike(e)) {
      io.err(`cribra ${name}: ${oneLine((e as Error).message)}\n`);
      return EXIT_USAGE;
    }
    io.err(`cribra ${name}: internal error: ${oneLine(e instanceof Error ? e.message : String(e))}\n`);
    return EXIT_INTERNAL;
  }
}

// Errors re-thrown from worker threads lose their class; they keep the name and kind.
function isEngineErrorLike(e: unknown): boolean {
  return e instanceof Error && (e.name === 'EngineError' || typeof (e as { kind?: unknown }).kind === 'string');
}

function oneLine(message: string): string {
  return message.replace(/\s*\n\s*/g, ' ').trim();
}

import { EngineError } from '@cribra/engine';
import { CliError } from './cli-error';
import type { CommandIo } from './command';
import { COMMANDS } from './commands/registry';
import { CLI_TERMS, termLines } from './glossary';

/** Exit code of usage and input errors (bad flag, bad number, limits, domain errors). */
export const EXIT_USAGE = 2;
/** Exit code of an unexpected internal failure (a bug): still one line, no stack trace. */
export const EXIT_INTERNAL = 3;

function overview(): string {
  const width = Math.max(...COMMANDS.map((c) => c.name.length));
  const termWidth = Math.max(...CLI_TERMS.map((t) => t.term.length));
  return [
    'usage: cribra <command> [flags]   (cribra <command> --help for its flags)',
    '',
    ...COMMANDS.map((c) => `  ${c.name.padEnd(width)}  ${c.summary}${c.aliases?.length ? ` (also: cribra ${c.aliases.join(', cribra ')})` : ''}`),
    '',
    'Common flags: --json (machine-readable output; big numbers as decimal strings), --help.',
    'Integers may be written 1000, 1_000, 1e9 or 10^12. Ranges --from A --to N include both ends.',
    '',
    'Terms (docs/glossary.md):',
    ...CLI_TERMS.map((t) => `  ${t.term.padEnd(termWidth)}  ${t.meaning}`),
    '',
  ].join('\n');
}

/** The command called `name`, by its name or one of its aliases. */
function findCommand(name: string) {
  return COMMANDS.find((c) => c.name === name || c.aliases?.includes(name));
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
  const command = findCommand(name);
  if (!command) {
    io.err(`cribra: unknown command "${name}" (commands: ${COMMANDS.map((c) => c.name).join(', ')})\n`);
    return EXIT_USAGE;
  }
  if (rest.includes('--help') || rest.includes('-h')) {
    const aka = command.aliases?.length ? `also: ${command.aliases.map((a) => `cribra ${a}`).join(', ')}\n` : '';
    const terms = command.terms?.length ? `terms:\n${termLines(command.terms).join('\n')}\n` : '';
    io.out(`usage: ${command.usage}\n${command.summary}\n${aka}${terms}`);
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

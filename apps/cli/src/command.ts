/** Where a subcommand writes: stdout and stderr (tests pass collectors). */
export interface CommandIo {
  out(text: string): void;
  err(text: string): void;
}

/**
 * One `cribra` subcommand. `run` returns the exit code (0 success, 1 a failing claim for `run`,
 * 2 a usage or input error); it may throw CliError or EngineError, which the dispatcher turns
 * into one line on stderr and exit code 2.
 */
export interface Command {
  readonly name: string;
  readonly summary: string;
  readonly usage: string;
  /** Other names the command answers to (the glossary's terms beside the names scripts already use). */
  readonly aliases?: readonly string[];
  /** Glossary terms its --help explains (see glossary.ts). */
  readonly terms?: readonly string[];
  run(argv: readonly string[], io: CommandIo): Promise<number>;
}

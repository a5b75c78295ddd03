/** A usage error of the command line (bad flag, bad number, missing value): one line, exit code 2. */
export class CliError extends Error {
  override readonly name = 'CliError';
}

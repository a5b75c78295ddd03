import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

/** The built bin (the vitest global setup runs `tsc -b` first). */
export const CLI = fileURLToPath(new URL('../dist/main.js', import.meta.url));

export interface CliRun {
  code: number | null;
  stdout: string;
  stderr: string;
}

/** Runs the built `cribra` as a child process. */
export function cribra(...args: string[]): CliRun {
  const r = spawnSync(process.execPath, [CLI, ...args], { encoding: 'utf8', timeout: 120_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** Runs with --json and parses stdout, failing loudly on a non-zero exit. */
export function cribraJson(...args: string[]): Record<string, unknown> {
  const r = cribra(...args, '--json');
  if (r.code !== 0) throw new Error(`cribra ${args.join(' ')} exited ${r.code}: ${r.stderr}`);
  return JSON.parse(r.stdout) as Record<string, unknown>;
}

/** An error run: exit 2, exactly one line on stderr, no stack trace, nothing on stdout. */
export function expectUsageError(run: CliRun, fragment: RegExp): void {
  const lines = run.stderr.split('\n').filter((l) => l !== '');
  if (run.code !== 2) throw new Error(`expected exit 2, got ${run.code} (stderr: ${run.stderr})`);
  if (lines.length !== 1) throw new Error(`expected one stderr line, got ${lines.length}: ${run.stderr}`);
  if (/\n\s+at /.test(run.stderr) || /\.js:\d+/.test(run.stderr)) throw new Error(`stack trace on stderr: ${run.stderr}`);
  if (!fragment.test(lines[0]!)) throw new Error(`stderr "${lines[0]}" does not match ${fragment}`);
  if (run.stdout !== '') throw new Error(`unexpected stdout on error: ${run.stdout}`);
}

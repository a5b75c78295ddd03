#!/usr/bin/env node
// The `cribra` command line: see docs/cli.md.
import { main } from './cli';

main(process.argv.slice(2), {
  out: (s) => process.stdout.write(s),
  err: (s) => process.stderr.write(s),
}).then(
  (code) => {
    process.exitCode = code;
  },
  (e: unknown) => {
    process.stderr.write(`cribra: internal error: ${e instanceof Error ? e.message : String(e)}\n`);
    process.exitCode = 3;
  },
);

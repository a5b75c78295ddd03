// The one list of `cribra` subcommands (add new ones here).
import type { Command } from '../command';
import { admissibleCommand } from './admissible';
import { constantCommand } from './constant';
import { countCommand } from './count';
import { gapcountCommand } from './gapcount';
import { maxgapsCommand } from './maxgaps';
import { narrowestCommand } from './narrowest';
import { occurrencesCommand } from './occurrences';
import { runCommand } from './run';
import { wheelCommand } from './wheel';

const siftRunCommand: Command = {
  name: 'run',
  summary: 'run a notebook file headlessly (query and claim cells); exit 1 when a claim fails',
  usage: 'cribra run FILE [--json] [--workers N] [--timeout SECONDS] [--upload NAME=FILE]…',
  run: (argv, io) => runCommand([...argv], io.out, io.err),
};

export const COMMANDS: readonly Command[] = [
  admissibleCommand,
  wheelCommand,
  countCommand,
  occurrencesCommand,
  gapcountCommand,
  constantCommand,
  narrowestCommand,
  maxgapsCommand,
  siftRunCommand,
];

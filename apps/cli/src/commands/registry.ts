// The one list of `cribra` subcommands (add new ones here).
import type { Command } from '../command';
import { admissibleCommand } from './admissible';
import { constantCommand } from './constant';
import { countCommand } from './count';
import { gapcountCommand } from './gapcount';
import { maxgapsCommand } from './maxgaps';
import { narrowestCommand } from './narrowest';
import { occurrencesCommand } from './occurrences';
import { wheelCommand } from './wheel';

const siftRunCommand: Command = {
  name: 'run',
  summary: 'run a notebook file headlessly (query and claim cells); exit 1 when a claim fails',
  usage: 'cribra run FILE [--json] [--workers N] [--timeout SECONDS] [--upload NAME=FILE]…',
  // Loaded on demand: the language and its worker pool take most of a second to load.
  run: async (argv, io) => {
    // eslint-disable-next-line @typescript-eslint/no-require-imports -- deliberate lazy CommonJS load
    const { runCommand } = require('./run') as typeof import('./run');
    return runCommand([...argv], io.out, io.err);
  },
};

const verifyRecordCommand: Command = {
  name: 'verify',
  summary: 'check a lock record offline: its hash, then every query and claim cell re-run; exit 1 when one differs',
  usage: 'cribra verify RECORD.json|URL [--json] [--workers N] [--timeout SECONDS]',
  run: async (argv, io) => {
    // eslint-disable-next-line @typescript-eslint/no-require-imports -- deliberate lazy CommonJS load
    const { verifyCommand } = require('./verify') as typeof import('./verify');
    return verifyCommand([...argv], io.out, io.err);
  },
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
  verifyRecordCommand,
];

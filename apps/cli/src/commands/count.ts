// `cribra count` (also `cribra constellations`): constellations of a tuple among the primes of a range.
import { sievePrimeBlockParallel } from '@cribra/engine/node';
import type { Command } from '../command';
import { groupDigits, rangeText, toJson, tupleText } from '../format';
import { CliError } from '../cli-error';
import { parseInteger } from '../numbers';
import { parseFlags, requireFlag, WORKERS_FLAG, workersFlag } from '../options';
import { tupleFromFlags } from '../tuple-input';

export const countCommand: Command = {
  name: 'count',
  summary: 'constellations: count n in A..N with n + h prime for every h of the tuple',
  usage: 'cribra count (--tuple 0,2,6 | --pattern 0,2,6 | --file FILE) --to N [--from A] [--workers N] [--kernel auto|wasm|js] [--json]   (A..N includes both ends)',
  aliases: ['constellations'],
  terms: ['tuple', 'constellation', 'range'],
  async run(argv, io) {
    const flags = parseFlags(argv, {
      pattern: { type: 'string' }, tuple: { type: 'string' }, file: { type: 'string' }, from: { type: 'string' }, to: { type: 'string' }, kernel: { type: 'string' }, ...WORKERS_FLAG,
    });
    const pattern = tupleFromFlags(flags, 'pattern');
    const to = parseInteger(requireFlag(flags, 'to'), '--to');
    const from = typeof flags.from === 'string' ? parseInteger(flags.from, '--from') : 0n;
    const kernel = flags.kernel ?? 'auto';
    if (kernel !== 'auto' && kernel !== 'wasm' && kernel !== 'js') throw new CliError(`--kernel must be auto, wasm or js (got ${String(kernel)})`);
    const block = await sievePrimeBlockParallel(from, to, { patterns: [pattern], workers: workersFlag(flags), kernel });
    const stats = block.patterns[0]!;
    const result = { pattern: stats.pattern, from, to, count: BigInt(stats.count), first: stats.first, last: stats.last };
    if (flags.json) io.out(toJson(result));
    else {
      io.out(`tuple ${tupleText(stats.pattern)} in ${rangeText(from, to)}: ${groupDigits(stats.count)} constellation${stats.count === 1 ? '' : 's'}\n`);
      if (stats.first !== null) io.out(`first at n = ${groupDigits(stats.first)}, last at n = ${groupDigits(stats.last!)}\n`);
      io.out('(n counted when n ≥ from and n + max H ≤ to)\n');
    }
    return 0;
  },
};

// `cribra maxgaps` (also `cribra records`): record gaps between consecutive primes of a range, with their first primes.
import { sievePrimeBlockParallel } from '@cribra/engine/node';
import type { Command } from '../command';
import { groupDigits, rangeText, toJson } from '../format';
import { parseInteger } from '../numbers';
import { parseFlags, requireFlag, WORKERS_FLAG, workersFlag } from '../options';

export const maxgapsCommand: Command = {
  name: 'maxgaps',
  summary: 'record gaps between consecutive primes of A..N and the prime each follows',
  usage: 'cribra maxgaps --to N [--from A] [--workers N] [--json]   (A..N includes both ends)',
  aliases: ['records'],
  terms: ['record gap', 'range'],
  async run(argv, io) {
    const flags = parseFlags(argv, { from: { type: 'string' }, to: { type: 'string' }, ...WORKERS_FLAG });
    const to = parseInteger(requireFlag(flags, 'to'), '--to');
    const from = typeof flags.from === 'string' ? parseInteger(flags.from, '--from') : 0n;
    const block = await sievePrimeBlockParallel(from, to, { gaps: true, workers: workersFlag(flags) });
    const records = block.gaps!.records.map((r) => ({ gap: r.gap, after: r.after }));
    if (flags.json) io.out(toJson({ from, to, primes: BigInt(block.primeCount), records }));
    else {
      io.out(`record gaps between consecutive primes in ${rangeText(from, to)} (${groupDigits(block.primeCount)} primes):\n`);
      const width = Math.max(3, ...records.map((r) => String(r.gap).length));
      for (const r of records) io.out(`  ${String(r.gap).padStart(width)}  after ${groupDigits(r.after)}\n`);
    }
    return 0;
  },
};

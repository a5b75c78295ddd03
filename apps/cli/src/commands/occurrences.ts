// `cribra occurrences` (also `cribra hits`): the hits of a tuple in one period of a wheel level.
import { normalizeTuple, occurrenceCount } from '@cribra/engine';
import type { Command } from '../command';
import { groupDigits, toJson, tupleText } from '../format';
import { parseSmallInteger } from '../numbers';
import { parseFlags, requireFlag } from '../options';
import { tupleFromFlags } from '../tuple-input';

export const occurrencesCommand: Command = {
  name: 'occurrences',
  summary: 'hits: exact number of x in one period [1, p#] of wheel level p with x + h coprime to p# for all h',
  usage: 'cribra occurrences (--tuple 0,2 | --pattern 0,2 | --file FILE) --level P [--json]   (P prime ≤ 10^6)',
  aliases: ['hits'],
  terms: ['tuple', 'wheel level', 'hits'],
  async run(argv, io) {
    const flags = parseFlags(argv, { pattern: { type: 'string' }, tuple: { type: 'string' }, file: { type: 'string' }, level: { type: 'string' } });
    const values = tupleFromFlags(flags, 'pattern');
    const p = parseSmallInteger(requireFlag(flags, 'level'), '--level', 2, 1_000_000);
    const count = occurrenceCount(values, p);
    const pattern = normalizeTuple(values);
    if (flags.json) io.out(toJson({ pattern, level: p, count }));
    else io.out(`hits of ${tupleText(pattern)} in one period of level ${p} (x in [1, ${p}#] with x + h coprime to ${p}# for all h): ${groupDigits(count)}\n`);
    return 0;
  },
};

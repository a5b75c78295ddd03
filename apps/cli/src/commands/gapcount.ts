// `cribra gapcount`: exact number of consecutive gaps g in one period of a wheel level, with its closed form.
import { gapClosedForm, gapCount } from '@cribra/engine';
import type { Command } from '../command';
import { groupDigits, toJson } from '../format';
import { parseSmallInteger } from '../numbers';
import { parseFlags, requireFlag } from '../options';

export const gapcountCommand: Command = {
  name: 'gapcount',
  summary: 'number of gaps g between consecutive members of wheel level p (one period), closed form',
  usage: 'cribra gapcount --gap G --level P [--json]   (G even, 2 ≤ G ≤ 120; P prime ≤ 10^6)',
  terms: ['wheel level'],
  async run(argv, io) {
    const flags = parseFlags(argv, { gap: { type: 'string' }, level: { type: 'string' } });
    const g = parseSmallInteger(requireFlag(flags, 'gap'), '--gap', 1, 120);
    const p = parseSmallInteger(requireFlag(flags, 'level'), '--level', 2, 1_000_000);
    const count = gapCount(g, p);
    const form = gapClosedForm(g);
    const result = { gap: g, level: p, count, closedForm: form.text, closedFormRange: form.range };
    if (flags.json) io.out(toJson(result));
    else {
      io.out(`gaps of ${g} in one period of level ${p}: ${groupDigits(count)}\n`);
      io.out(`closed form: ${form.text}   (${form.range})\n`);
    }
    return 0;
  },
};

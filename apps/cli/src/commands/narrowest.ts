// `cribra narrowest`: the narrowest admissible k-tuple (exact H(k) for small k, constructions above).
import { CONSTRUCT_MAX_K, EXACT_MAX_K, narrowTuple } from '@cribra/engine';
import type { Command } from '../command';
import { groupDigits, toJson, tupleText } from '../format';
import { parseSmallInteger } from '../numbers';
import { parseFlags, requireFlag } from '../options';

export const narrowestCommand: Command = {
  name: 'narrowest',
  summary: `narrowest admissible k-tuple: exact H(k) for k ≤ ${EXACT_MAX_K}, best construction above`,
  usage: `cribra narrowest --k K [--json]   (1 ≤ K ≤ ${CONSTRUCT_MAX_K})`,
  terms: ['tuple', 'admissible'],
  async run(argv, io) {
    const flags = parseFlags(argv, { k: { type: 'string' } });
    const k = parseSmallInteger(requireFlag(flags, 'k'), '--k', 1, CONSTRUCT_MAX_K);
    const r = narrowTuple(k);
    if (flags.json) {
      io.out(toJson({ k: r.k, diameter: r.diameter, tuple: r.tuple, exact: r.exact, method: r.method, witness: r.witness }));
    } else {
      io.out(r.exact ? `H(${k}) = ${groupDigits(r.diameter)} (exhaustive search)\n` : `H(${k}) ≤ ${groupDigits(r.diameter)} (${r.method}; an upper bound)\n`);
      if (k <= 200) io.out(`tuple: ${tupleText(r.tuple)}\n`);
      else io.out(`tuple: {${r.tuple.slice(0, 10).join(', ')}, …} (${groupDigits(k)} offsets; --json prints all)\n`);
    }
    return 0;
  },
};

// `cribra narrowest`: the narrowest admissible k-tuple (exact H(k) for small k, constructions above,
// and with --search a local search on worker threads for the given number of seconds).
import { CONSTRUCT_MAX_K, EXACT_MAX_K, narrowTuple } from '@cribra/engine';
import { narrowSearchParallel } from '@cribra/engine/node';
import type { Command } from '../command';
import { groupDigits, toJson, tupleText } from '../format';
import { parseSmallInteger } from '../numbers';
import { parseFlags, requireFlag, WORKERS_FLAG, workersFlag } from '../options';

export const narrowestCommand: Command = {
  name: 'narrowest',
  summary: `narrowest admissible k-tuple: exact H(k) for k ≤ ${EXACT_MAX_K}, best construction or local search above`,
  usage: `cribra narrowest --k K [--search SECONDS [--workers N]] [--json]   (1 ≤ K ≤ ${CONSTRUCT_MAX_K}, 1 ≤ SECONDS ≤ 86 400)`,
  terms: ['tuple', 'admissible'],
  async run(argv, io) {
    const flags = parseFlags(argv, { k: { type: 'string' }, search: { type: 'string' }, ...WORKERS_FLAG });
    const k = parseSmallInteger(requireFlag(flags, 'k'), '--k', 1, CONSTRUCT_MAX_K);
    const seconds = typeof flags.search === 'string' ? parseSmallInteger(flags.search, '--search', 1, 86_400) : undefined;
    const t0 = performance.now();
    const searched = seconds === undefined ? null : await narrowSearchParallel(k, { seconds, workers: workersFlag(flags) });
    const r = searched ?? narrowTuple(k);
    // Fields added by --search (the fields above them are unchanged).
    const extra = searched
      ? { baseline: searched.baseline, searchSeconds: seconds, workers: workersFlag(flags), pieces: searched.pieces, elapsedSeconds: Math.round(performance.now() - t0) / 1000 }
      : null;
    if (flags.json) {
      io.out(toJson({ k: r.k, diameter: r.diameter, tuple: r.tuple, exact: r.exact, method: r.method, witness: r.witness, ...(extra ?? {}) }));
    } else {
      io.out(r.exact ? `H(${k}) = ${groupDigits(r.diameter)} (exhaustive search)\n` : `H(${k}) ≤ ${groupDigits(r.diameter)} (${r.method}; an upper bound)\n`);
      if (extra) io.out(`search: ${extra.searchSeconds} s on ${extra.workers} ${extra.workers === 1 ? 'worker' : 'workers'}, ${extra.pieces} pieces; narrowest without search: ${groupDigits(extra.baseline)}\n`);
      if (k <= 200) io.out(`tuple: ${tupleText(r.tuple)}\n`);
      else io.out(`tuple: {${r.tuple.slice(0, 10).join(', ')}, …} (${groupDigits(k)} offsets; --json prints all)\n`);
    }
    return 0;
  },
};

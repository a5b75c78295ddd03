import {
  greedyGreedySieve, hensleyRichardsTuple, improveTuple, narrowSearch, narrowTuple, searchStepsFor, type NarrowTuple, schinzelSieveTuple, tupleOfDiameter,
} from '@cribra/engine';
import { domainError, typeError } from '../errors';
import { SiftRecord, Table, Tuple, type Value } from '../values/types';
import { argRange, argSmall, argString, argTuple, type Builtin, defineBuiltins } from './registry';

function narrowRecord(t: NarrowTuple, extra: [string, Value][] = []): SiftRecord {
  return SiftRecord.of([
    ['k', BigInt(t.k)],
    ['diameter', BigInt(t.diameter)],
    ['tuple', new Tuple(t.tuple.map(BigInt))],
    ['method', t.method],
    ...extra,
    ['witness', new Table(['prime', 'residue'], Object.keys(t.witness).map(Number).sort((x, y) => x - y).map((q) => [BigInt(q), BigInt(t.witness[q]!)]))],
  ]);
}

const METHODS = ['hensley-richards', 'schinzel', 'greedy-greedy'] as const;

const narrow: Builtin[] = [
  {
    name: 'narrowest', area: 'narrow', minArgs: 1, maxArgs: 1,
    signature: 'narrowest(k) → record (k, diameter, tuple, method, exact, witness)',
    doc: 'The narrowest admissible k-tuple found: exact H(k) by exhaustive search for k ≤ 100 (exact = true), else the best construction after local improvement.',
    example: { source: 'narrowest(5).diameter', result: '12' },
    call: (a, c) => {
      const k = argSmall(a, 0, c, 'narrowest', 1, 200_000);
      const work = c.work(`narrowest admissible ${k}-tuple`);
      work.onProgress?.(0);
      const t = narrowTuple(k, work);
      return narrowRecord(t, [['exact', t.exact]]);
    },
  },
  {
    name: 'narrowsearch', area: 'narrow', minArgs: 2, maxArgs: 2,
    signature: 'narrowsearch(k, seconds) → record (k, diameter, tuple, method, exact, baseline, witness)',
    doc: 'A narrower admissible k-tuple by local search on top of narrowest(k) (never wider; baseline is narrowest(k).diameter); seconds is a nominal budget turned into a fixed number of moves, so the result is reproducible.',
    example: { source: 'narrowsearch(20, 1).diameter', result: '80' },
    call: (a, c) => {
      const k = argSmall(a, 0, c, 'narrowsearch', 1, 50_000);
      const seconds = argSmall(a, 1, c, 'narrowsearch', 1, 3_600);
      const work = c.work(`narrow search for k = ${k}`);
      work.onProgress?.(0);
      // A move count, not the clock: the same call gives the same tuple (and digest) on any machine.
      const t = narrowSearch(k, { steps: searchStepsFor(k, seconds), pieces: Math.min(8, seconds), hooks: work });
      return narrowRecord(t, [['exact', t.exact], ['baseline', BigInt(t.baseline)]]);
    },
  },
  {
    name: 'construct', area: 'narrow', minArgs: 2, maxArgs: 2,
    signature: 'construct(k, method) → record (k, diameter, tuple, method, witness)',
    doc: 'An admissible k-tuple by one construction: "hensley-richards", "schinzel" or "greedy-greedy" (centred interval).',
    example: { source: 'construct(50, "schinzel").k', result: '50' },
    call: (a, c) => {
      const k = argSmall(a, 0, c, 'construct', 1, 200_000);
      const method = argString(a, 1, c, 'construct');
      if (method === 'hensley-richards') return narrowRecord(hensleyRichardsTuple(k));
      if (method === 'schinzel') return narrowRecord(schinzelSieveTuple(k));
      if (method === 'greedy-greedy') {
        // A centred interval a little wider than k·ln k; widened until k survive.
        const fixedBound = Math.max(3, Math.round(Math.sqrt(k * Math.log(Math.max(k, 2)))));
        let half = Math.ceil((k * Math.log(Math.max(k, 3)) + k) / 2);
        for (let i = 0; i < 40; i++) {
          c.tick(1000);
          const all = greedyGreedySieve({ from: -half, to: half, fixedBound });
          if (all.k >= k) return narrowRecord(greedyGreedySieve({ from: -half, to: half, fixedBound, k }), [['origin', BigInt(all.origin)]]);
          half = Math.ceil(half * 1.2) + 2;
        }
        throw domainError(`construct: greedy-greedy sieving left fewer than ${k} survivors`, c.span);
      }
      throw typeError(`construct: method must be one of ${METHODS.map((m) => `"${m}"`).join(', ')}`, c.argSpans[1]);
    },
  },
  {
    name: 'greedygreedy', area: 'narrow', minArgs: 2, maxArgs: 3,
    signature: 'greedygreedy(a..b, bound[, k]) → record (k, diameter, tuple, method, origin, witness)',
    doc: 'Sieve the interval a..b by 1 mod 2 and 0 mod q for odd q ≤ bound (bound 0: plain greedy), then greedily by the least occupied class; the survivors (or the narrowest k of them) are admissible.',
    example: { source: 'greedygreedy(-185662..202456, 137).k', result: '34429' },
    call: (a, c) => {
      const r = argRange(a, 0, c, 'greedygreedy');
      const bound = argSmall(a, 1, c, 'greedygreedy', 0, 10_000_000);
      const k = a.length === 3 ? argSmall(a, 2, c, 'greedygreedy', 1, 1_000_000) : undefined;
      if (r.lo < -(2n ** 52n) || r.hi > 2n ** 52n) throw domainError('greedygreedy: the interval must lie within ±2^52', c.argSpans[0]);
      c.progress(0, 'sieving the interval');
      const t = greedyGreedySieve({ from: Number(r.lo), to: Number(r.hi), fixedBound: bound, k });
      return narrowRecord(t, [['origin', BigInt(t.origin)]]);
    },
  },
  {
    name: 'improve', area: 'narrow', minArgs: 1, maxArgs: 1,
    signature: 'improve(H) → record (k, diameter, tuple, method, witness)',
    doc: 'Local improvement of an admissible tuple: drop an end point and insert an inner point while admissibility allows, lowering the diameter.',
    example: { source: 'improve(construct(30, "schinzel").tuple).diameter ≤ construct(30, "schinzel").diameter', result: 'true' },
    call: (a, c) => {
      const h = argTuple(a, 0, c, 'improve');
      const lo = h[0] ?? 0n;
      return narrowRecord(improveTuple(h.map((x) => Number(x - lo))));
    },
  },
  {
    name: 'withdiameter', area: 'narrow', minArgs: 2, maxArgs: 2,
    signature: 'withdiameter(k, d) → tuple or false',
    doc: 'An admissible k-tuple of diameter exactly d inside [0, d] (exhaustive search, k ≤ 100), or false if none exists.',
    example: { source: 'withdiameter(5, 12)', result: '{0, 2, 6, 8, 12}' },
    call: (a, c) => {
      const k = argSmall(a, 0, c, 'withdiameter', 1, 100);
      const d = argSmall(a, 1, c, 'withdiameter', 0, 100_000);
      const t = tupleOfDiameter(k, d);
      return t ? new Tuple(t.map(BigInt)) : false;
    },
  },
];

defineBuiltins(narrow);

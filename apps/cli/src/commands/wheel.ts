// `cribra wheel`: one wheel level — modulus p#, φ(p#) members, largest gap, full gap histogram.
import {
  checkedHistogram, defaultSplitBase, gapHistogram, histogramByCounts, histogramMaxGap, primorial, primorialTotient,
  SPLIT_MAX_LEVEL, type GapHistogram,
} from '@cribra/engine';
import { gapHistogramParallel, splitHistogramsParallel } from '@cribra/engine/node';
import { CliError } from '../cli-error';
import type { Command } from '../command';
import { groupDigits, toJson } from '../format';
import { parseSmallInteger } from '../numbers';
import { parseFlags, requireFlag, WORKERS_FLAG, workersFlag } from '../options';

const MAX_LEVEL = SPLIT_MAX_LEVEL;
/** Exact routes to a histogram; every one ends with the two identities checked. */
const ROUTES = ['enumerated', 'recursion', 'split', 'closed-form'] as const;
type Route = (typeof ROUTES)[number];

/** Default route: enumeration to 23#, the fast recursions at 29# and 31#, the split route from 37#. */
function defaultRoute(p: number): Route {
  if (p <= 23) return 'enumerated';
  if (p <= 31) return 'recursion';
  return 'split';
}

function checkRoute(route: Route, p: number): void {
  if (route === 'enumerated' && p > 23) throw new CliError(`--route enumerated holds levels ≤ 23 in memory, not ${p}`);
  if (route === 'recursion' && p > 37) throw new CliError(`--route recursion reaches level 37 at most, not ${p}`);
  if (route === 'split' && p < 7) throw new CliError(`--route split needs a level of 7 or more (its base is two primes below), not ${p}`);
}

async function histogramBy(route: Route, p: number, workers: number): Promise<GapHistogram> {
  switch (route) {
    case 'enumerated':
    case 'recursion':
      // gapHistogram enumerates to 23# and takes the recursions beyond; 37# streams 29#'s quadruples
      return p >= 37 ? gapHistogramParallel(p, { workers }) : gapHistogram(p);
    case 'closed-form':
      return histogramByCounts(p);
    case 'split':
      return (await splitHistogramsParallel([p], { workers, base: defaultSplitBase(p) })).histograms.get(p)!;
  }
}

export const wheelCommand: Command = {
  name: 'wheel',
  summary: 'wheel level p: modulus p#, members φ(p#), largest gap, gap histogram',
  usage: `cribra wheel --level P [--route ${ROUTES.join('|')}] [--workers N] [--json]   (P prime, 2 ≤ P ≤ ${MAX_LEVEL})`,
  terms: ['wheel level', 'largest gap'],
  async run(argv, io) {
    const flags = parseFlags(argv, { level: { type: 'string' }, route: { type: 'string' }, ...WORKERS_FLAG });
    const p = parseSmallInteger(requireFlag(flags, 'level'), '--level', 2, MAX_LEVEL);
    const workers = workersFlag(flags);
    const asked = flags.route;
    if (typeof asked === 'string' && !(ROUTES as readonly string[]).includes(asked)) {
      throw new CliError(`--route must be one of ${ROUTES.join(', ')}, not '${asked}'`);
    }
    const route = (asked as Route | undefined) ?? defaultRoute(p);
    checkRoute(route, p);
    // Σ n_g = φ(p#) and Σ g·n_g = p# before anything is printed (whatever the route)
    const histogram = checkedHistogram(p, await histogramBy(route, p, workers));
    const gaps = [...histogram.keys()].sort((a, b) => a - b);
    const result = {
      prime: p,
      modulus: primorial(p),
      members: primorialTotient(p),
      maxGap: histogramMaxGap(histogram),
      histogram: Object.fromEntries(gaps.map((g) => [String(g), histogram.get(g)!])),
      route,
    };
    if (flags.json) io.out(toJson(result));
    else {
      io.out(`wheel level ${p}: modulus ${p}# = ${groupDigits(result.modulus)}, members φ(${p}#) = ${groupDigits(result.members)}\n`);
      io.out(`largest gap ${result.maxGap} (the Jacobsthal value j(${p}#)); route ${route}; Σ counts = φ(${p}#) and Σ gap·count = ${p}# checked\n`);
      const width = Math.max(...gaps.map((g) => String(g).length));
      for (const g of gaps) io.out(`  gap ${String(g).padStart(width)}  ${groupDigits(histogram.get(g)!)}\n`);
    }
    return 0;
  },
};

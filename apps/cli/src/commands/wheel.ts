// `cribra wheel`: one wheel level — modulus p#, φ(p#) members, largest gap, full gap histogram.
import { histogramMaxGap, primorial, primorialTotient, wheelLevel, type GapHistogram } from '@cribra/engine';
import { gapHistogramParallel } from '@cribra/engine/node';
import type { Command } from '../command';
import { groupDigits, toJson } from '../format';
import { parseSmallInteger } from '../numbers';
import { parseFlags, requireFlag, WORKERS_FLAG, workersFlag } from '../options';

// Levels from here on stream the previous level's members: share them between worker threads.
const PARALLEL_FROM = 37;
const MAX_LEVEL = 37;

export const wheelCommand: Command = {
  name: 'wheel',
  summary: 'wheel level p: modulus p#, members φ(p#), largest gap, gap histogram',
  usage: `cribra wheel --level P [--workers N] [--json]   (P prime, 2 ≤ P ≤ ${MAX_LEVEL})`,
  terms: ['wheel level', 'largest gap'],
  async run(argv, io) {
    const flags = parseFlags(argv, { level: { type: 'string' }, ...WORKERS_FLAG });
    const p = parseSmallInteger(requireFlag(flags, 'level'), '--level', 2, MAX_LEVEL);
    const workers = workersFlag(flags);
    let histogram: GapHistogram;
    if (p >= PARALLEL_FROM) histogram = await gapHistogramParallel(p, { workers });
    else histogram = wheelLevel(p).histogram;
    const gaps = [...histogram.keys()].sort((a, b) => a - b);
    const result = {
      prime: p,
      modulus: primorial(p),
      members: primorialTotient(p),
      maxGap: histogramMaxGap(histogram),
      histogram: Object.fromEntries(gaps.map((g) => [String(g), histogram.get(g)!])),
    };
    if (flags.json) io.out(toJson(result));
    else {
      io.out(`wheel level ${p}: modulus ${p}# = ${groupDigits(result.modulus)}, members φ(${p}#) = ${groupDigits(result.members)}\n`);
      io.out(`largest gap ${result.maxGap} (the Jacobsthal value j(${p}#))\n`);
      const width = Math.max(...gaps.map((g) => String(g).length));
      for (const g of gaps) io.out(`  gap ${String(g).padStart(width)}  ${groupDigits(histogram.get(g)!)}\n`);
    }
    return 0;
  },
};
